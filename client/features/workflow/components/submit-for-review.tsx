import type { Assignment } from '@contracts/assignments';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { describeError, isApiError } from '../../../lib/api-error';
import { useTransition } from '../hooks/use-transition';

interface SubmitForReviewProps {
  assignment: Assignment;
  /** What the grid still lacks, from the server's last answer. */
  missing: readonly string[];
  onSettled: () => Promise<unknown>;
}

/** The appraiser's one primary action on the grid: send the file to the reviewer. The server checks
 * the same list shown here and refuses with it; its answer is shown as it came. */
export function SubmitForReview({ assignment, missing, onSettled }: SubmitForReviewProps) {
  const submit = useTransition(assignment.id, onSettled);
  const again = assignment.status === 'revisions_requested';
  const refusal = submit.isError ? submit.error : null;
  const refusedForGaps = isApiError(refusal) && refusal.status === 422;

  return (
    <div className="flex flex-col gap-3">
      {missing.length > 0 && (
        <div className="rounded-md border border-rule-strong bg-paper px-4 py-3" data-testid="submission-missing">
          <p className="text-sm font-semibold text-ink">{refusedForGaps ? 'The server refused the submission. Still to complete:' : 'Before submitting, complete:'}</p>
          <ul className="mt-1.5 flex flex-col gap-1 text-[0.9375rem] text-ink-soft">
            {missing.map((item) => (
              <li key={item} className="flex gap-2">
                <span aria-hidden className="mt-2 size-1.5 shrink-0 rounded-full bg-rust" />
                {item}
              </li>
            ))}
          </ul>
        </div>
      )}
      {refusal && !(refusedForGaps && missing.length > 0) && <Notice tone="error" title="Not submitted">{describeError(refusal)}</Notice>}
      {submit.isSuccess && <Notice tone="success" title="Submitted for review">The reviewers have been e-mailed. The grid is read-only while the file is in review.</Notice>}
      <div className="flex flex-wrap items-center gap-4">
        <Button
          variant="primary"
          busy={submit.isPending}
          busyLabel="Submitting…"
          onClick={() => submit.mutate({ action: 'submit', version: assignment.version })}
        >
          {again ? 'Submit again for review' : 'Submit for review'}
        </Button>
        <p className="text-[0.8125rem] text-ink-faint">The reviewer is e-mailed; you can answer their queries on the Review step.</p>
      </div>
    </div>
  );
}
