import { useState } from 'react';
import type { Assignment } from '@contracts/assignments';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { countOf } from '../../../lib/count-of';
import { describeError } from '../../../lib/api-error';
import { useTransition } from '../hooks/use-transition';

interface ReviewerDecisionProps {
  assignment: Assignment;
  /** Queries not yet resolved: approval waits for none. */
  unresolvedQueries: number;
  onSettled: () => Promise<unknown>;
}

/** The reviewer's decision on a file in review: approve it (once every query is resolved) or return
 * it to the appraiser with a note saying what to revise. */
export function ReviewerDecision({ assignment, unresolvedQueries, onSettled }: ReviewerDecisionProps) {
  const decide = useTransition(assignment.id, onSettled);
  const [returning, setReturning] = useState(false);
  const [note, setNote] = useState('');
  const [tried, setTried] = useState(false);
  const blocked = unresolvedQueries > 0;
  const noteError = tried && note.trim() === '' ? 'Say what needs revising: the appraiser reads this first.' : undefined;

  function requestRevisions() {
    setTried(true);
    if (note.trim() === '') return;
    decide.mutate({ action: 'request-revisions', version: assignment.version, note: note.trim() }, { onSuccess: () => setReturning(false) });
  }

  return (
    <section aria-labelledby="decision-title" className="flex flex-col gap-3 rounded-lg border border-ink/25 bg-paper-raised px-5 py-4">
      <h3 id="decision-title" className="text-base font-semibold">
        Your decision
      </h3>
      {decide.isError && <Notice tone="error" title="Not done">{describeError(decide.error)}</Notice>}
      {returning ? (
        <div className="flex flex-col gap-3">
          <label htmlFor="revisions-note" className="text-sm font-semibold text-ink">
            What needs revising (required)
          </label>
          <textarea
            id="revisions-note"
            rows={4}
            value={note}
            maxLength={4000}
            onChange={(e) => setNote(e.target.value)}
            aria-invalid={noteError ? true : undefined}
            aria-describedby={noteError ? 'revisions-note-error' : undefined}
            className={`block w-full rounded-md border bg-paper-raised px-3 py-2 text-[0.9375rem] leading-relaxed focus:border-ink focus:ring-2 focus:ring-ink/15 focus:outline-none ${noteError ? 'border-rust' : 'border-rule-strong'}`}
          />
          {noteError && (
            <p id="revisions-note-error" className="text-[0.8125rem] font-medium text-rust">
              {noteError}
            </p>
          )}
          <div className="flex flex-wrap gap-3">
            <Button variant="danger" onClick={requestRevisions} busy={decide.isPending} busyLabel="Returning…">
              Return for revisions
            </Button>
            <Button variant="quiet" onClick={() => setReturning(false)}>
              Cancel
            </Button>
          </div>
        </div>
      ) : (
        <div className="flex flex-col gap-3">
          <div className="flex flex-wrap items-center gap-3">
            <Button
              variant="primary"
              disabled={blocked}
              aria-describedby="approve-explanation"
              busy={decide.isPending}
              busyLabel="Approving…"
              onClick={() => decide.mutate({ action: 'approve', version: assignment.version })}
            >
              Approve
            </Button>
            <Button onClick={() => setReturning(true)}>Request revisions</Button>
          </div>
          <p id="approve-explanation" className="text-[0.875rem] text-ink-soft">
            {blocked
              ? `Approval waits until every query is resolved: ${countOf(unresolvedQueries, 'query is', 'queries are')} still open or answered.`
              : 'Every query is resolved. Approving e-mails the appraiser, who may then sign.'}
          </p>
        </div>
      )}
    </section>
  );
}
