import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { describeError } from '../../../lib/api-error';
import { useQueryActions } from '../hooks/use-query-actions';
import { ThreadForm } from './thread-form';

interface RaiseQueryProps {
  assignmentId: number;
  /** The sale asked about; null for a question on the assignment as a whole. */
  saleId: number | null;
  about: string;
  onRaised: () => Promise<unknown>;
  buttonLabel?: string;
}

/** The reviewer's "Raise a query": a button that opens the question's text box in place. */
export function RaiseQuery({ assignmentId, saleId, about, onRaised, buttonLabel = 'Raise a query' }: RaiseQueryProps) {
  const [open, setOpen] = useState(false);
  const raise = useQueryActions(assignmentId, onRaised);
  if (!open) {
    return (
      <Button size="sm" onClick={() => setOpen(true)} aria-label={saleId === null ? buttonLabel : `${buttonLabel} on ${about}`}>
        {buttonLabel}
      </Button>
    );
  }
  return (
    <div className="flex w-full flex-col gap-2">
      {raise.isError && <Notice tone="error" title="The query was not raised">{describeError(raise.error)}</Notice>}
      <ThreadForm
        label={saleId === null ? 'Your question on the assignment' : `Your question on ${about}`}
        placeholder={saleId === null ? undefined : 'What about this sale needs explaining? The appraiser keeps it with an explanation or excludes it with a reason.'}
        submitLabel="Send the query"
        busyLabel="Sending…"
        busy={raise.isPending}
        requiredMessage="Write the question."
        onSubmit={(body) => raise.mutate({ kind: 'raise', saleId, body }, { onSuccess: () => setOpen(false) })}
        onCancel={() => setOpen(false)}
      />
    </div>
  );
}
