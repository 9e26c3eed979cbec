import { useState } from 'react';
import type { Role } from '@contracts/auth';
import type { ReviewQuery } from '@contracts/review';
import { Badge } from '../../../components/ui/badge';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { describeError } from '../../../lib/api-error';
import { formatDateTime } from '../../../lib/format-date';
import { useQueryActions } from '../hooks/use-query-actions';
import { messageKindLabels, queryStatusLabels, queryStatusTone } from '../lib/message-words';
import { ThreadForm } from './thread-form';

type Mode = null | 'keep' | 'exclude' | 'comment' | 'resolve' | 'reopen';

export interface ThreadPermissions {
  role: Role;
  /** The appraiser may answer while the file is not approved or signed. */
  canAnswer: boolean;
  /** The reviewer may resolve and reopen while the file is in review. */
  canDecide: boolean;
}

interface QueryThreadProps {
  assignmentId: number;
  query: ReviewQuery;
  permissions: ThreadPermissions;
  onSaleChanged: () => Promise<unknown>;
}

const markByKind: Record<ReviewQuery['messages'][number]['kind'], string> = {
  question: 'border-ink',
  comment: 'border-rule-strong',
  kept: 'border-teal',
  excluded: 'border-rust',
  resolved: 'border-teal',
  reopened: 'border-ochre-deep',
};

/** One query and its thread: the question, comments, the appraiser's keep-or-exclude answer, and
 * the reviewer's resolve or reopen, each with who and when. */
export function QueryThread({ assignmentId, query, permissions, onSaleChanged }: QueryThreadProps) {
  const actions = useQueryActions(assignmentId, onSaleChanged);
  const [mode, setMode] = useState<Mode>(null);
  const onSale = query.saleId !== null;
  const about = query.saleAddress ?? 'The assignment as a whole';
  const isAppraiser = permissions.role === 'appraiser';
  const isReviewer = permissions.role === 'reviewer';
  const close = { onSuccess: () => setMode(null) };

  return (
    <article id={`query-${query.id}`} aria-label={`Query on ${about}`} className="rounded-lg border border-rule bg-paper-raised" data-testid="query-thread">
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-rule px-5 py-3">
        <div className="min-w-0">
          <p className="text-xs font-semibold tracking-wide text-ink-faint uppercase">{onSale ? 'Query on a sale' : 'General query'}</p>
          <h4 className="text-base font-semibold text-ink">{about}</h4>
        </div>
        <Badge tone={queryStatusTone[query.status]}>{queryStatusLabels[query.status]}</Badge>
      </header>

      <ol className="flex flex-col gap-3 px-5 py-4">
        {query.messages.map((message) => (
          <li key={message.id} className={`border-l-[3px] pl-3 ${markByKind[message.kind]}`}>
            <p className="text-[0.8125rem] text-ink-faint">
              <span className="font-semibold text-ink">{messageKindLabels[message.kind]}</span> · {message.authorName} ({message.authorRole}) ·{' '}
              <span className="figures">{formatDateTime(message.createdAt)}</span>
            </p>
            <p className="mt-0.5 text-[0.9375rem] leading-relaxed whitespace-pre-wrap text-ink">{message.body}</p>
          </li>
        ))}
      </ol>

      <footer className="flex flex-col gap-3 border-t border-rule bg-paper/50 px-5 py-3">
        {actions.isError && <Notice tone="error" title="Not sent">{describeError(actions.error)}</Notice>}
        {mode === 'keep' && (
          <ThreadForm
            label={onSale ? 'Why the sale stays (from the facts of the sale)' : 'Your answer'}
            submitLabel={onSale ? 'Keep the sale' : 'Send the answer'}
            busyLabel="Sending…"
            busy={actions.isPending}
            minLength={3}
            requiredMessage="Explain why, from the facts of the sale."
            onSubmit={(explanation) => actions.mutate({ kind: 'answer', queryId: query.id, version: query.version, action: 'keep', explanation }, close)}
            onCancel={() => setMode(null)}
          />
        )}
        {mode === 'exclude' && (
          <ThreadForm
            label="Reason for excluding the sale (shown beside it, struck through)"
            submitLabel="Exclude the sale"
            busyLabel="Excluding…"
            tone="danger"
            busy={actions.isPending}
            minLength={3}
            requiredMessage="Give the reason from the facts of the sale."
            onSubmit={(explanation) => actions.mutate({ kind: 'answer', queryId: query.id, version: query.version, action: 'exclude', explanation }, close)}
            onCancel={() => setMode(null)}
          />
        )}
        {mode === 'comment' && (
          <ThreadForm
            label="Comment"
            submitLabel="Add the comment"
            busyLabel="Sending…"
            busy={actions.isPending}
            onSubmit={(body) => actions.mutate({ kind: 'comment', queryId: query.id, body }, close)}
            onCancel={() => setMode(null)}
          />
        )}
        {(mode === 'resolve' || mode === 'reopen') && (
          <ThreadForm
            label={mode === 'resolve' ? 'Note on resolving (optional)' : 'Why reopen it (optional)'}
            submitLabel={mode === 'resolve' ? 'Resolve the query' : 'Reopen the query'}
            busyLabel={mode === 'resolve' ? 'Resolving…' : 'Reopening…'}
            busy={actions.isPending}
            minLength={0}
            onSubmit={(body) => actions.mutate({ kind: mode, queryId: query.id, version: query.version, body: body || undefined }, close)}
            onCancel={() => setMode(null)}
          />
        )}
        {mode === null && (
          <div className="flex flex-wrap items-center gap-2">
            {isAppraiser && permissions.canAnswer && query.status === 'open' && (
              <>
                <Button size="sm" onClick={() => setMode('keep')}>
                  {onSale ? 'Keep the sale' : 'Answer'}
                </Button>
                {onSale && (
                  <Button size="sm" variant="danger" onClick={() => setMode('exclude')}>
                    Exclude the sale
                  </Button>
                )}
              </>
            )}
            {isReviewer && permissions.canDecide && query.status !== 'resolved' && (
              <Button size="sm" onClick={() => setMode('resolve')}>
                Resolve
              </Button>
            )}
            {isReviewer && permissions.canDecide && query.status === 'resolved' && (
              <Button size="sm" onClick={() => setMode('reopen')}>
                Reopen
              </Button>
            )}
            {query.status !== 'resolved' && (isAppraiser || isReviewer) && (
              <Button size="sm" variant="quiet" className="text-sm" onClick={() => setMode('comment')}>
                Add a comment
              </Button>
            )}
            <WaitingNote query={query} isAppraiser={isAppraiser} />
          </div>
        )}
      </footer>
    </article>
  );
}

function WaitingNote({ query, isAppraiser }: { query: ReviewQuery; isAppraiser: boolean }) {
  const text =
    query.status === 'resolved'
      ? 'Resolved: nothing more is needed.'
      : query.status === 'answered'
        ? isAppraiser
          ? 'Answered: waiting for the reviewer to resolve it.'
          : 'Answered: resolve it, or add a comment if it needs more.'
        : isAppraiser
          ? 'Waiting for your answer.'
          : 'Waiting for the appraiser’s answer.';
  return <span className="ml-auto text-[0.8125rem] text-ink-faint">{text}</span>;
}
