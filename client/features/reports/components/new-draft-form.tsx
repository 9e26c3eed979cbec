import { useState } from 'react';
import { useMutation } from '@tanstack/react-query';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextAreaField } from '../../../components/ui/field';
import { describeError, isApiError } from '../../../lib/api-error';
import { reportRequests } from '../api/report-queries';

/** Reopens a signed assignment as a new draft, with the reason on its timeline. Signed versions
 * stay exactly as they were; signing the draft issues the next version. */
export function NewDraftForm({ assignmentId, version, onOpened }: { assignmentId: number; version: number; onOpened: () => void | Promise<void> }) {
  const [open, setOpen] = useState(false);
  const [reason, setReason] = useState('');
  const draft = useMutation({ mutationFn: () => reportRequests.newDraft(assignmentId, { version, reason }), onSuccess: onOpened });
  if (!open) {
    return (
      <Button onClick={() => setOpen(true)} className="self-start">
        Open a new draft…
      </Button>
    );
  }
  const fieldError = isApiError(draft.error) ? draft.error.fields?.reason : undefined;
  return (
    <form
      aria-label="Open a new draft"
      className="flex max-w-2xl flex-col gap-3 rounded-lg border border-rule-strong bg-paper-raised px-4 py-4"
      onSubmit={(event) => {
        event.preventDefault();
        draft.mutate();
      }}
    >
      {draft.isError && !fieldError && <Notice tone="error">{describeError(draft.error)}</Notice>}
      <TextAreaField label="Why a new draft is needed" hint="Recorded on the assignment’s timeline." value={reason} onChange={(event) => setReason(event.target.value)} error={fieldError} />
      <div className="flex flex-wrap gap-2">
        <Button type="submit" size="sm" variant="primary" disabled={reason.trim().length < 3} busy={draft.isPending} busyLabel="Opening…">
          Open the new draft
        </Button>
        <Button size="sm" variant="quiet" onClick={() => setOpen(false)}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
