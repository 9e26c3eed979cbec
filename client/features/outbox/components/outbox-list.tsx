import { useQuery } from '@tanstack/react-query';
import type { OutboxMessage } from '@contracts/users';
import { Badge } from '../../../components/ui/badge';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { countOf } from '../../../lib/count-of';
import { formatDateTime } from '../../../lib/format-date';
import { outboxQueries } from '../api/outbox-queries';

const statusBadge: Record<OutboxMessage['status'], { tone: 'positive' | 'pending' | 'negative'; label: string }> = {
  sent: { tone: 'positive', label: 'Sent' },
  queued: { tone: 'pending', label: 'Queued' },
  failed: { tone: 'negative', label: 'Failed' },
};

/** Every e-mail Compline sent or is still trying to send, newest first; each opens to its text. */
export function OutboxList() {
  const messages = useQuery(outboxQueries.messages());

  if (messages.isPending) return <LoadingPanel label="Loading the outbox…" />;
  if (messages.isError) {
    return <ErrorPanel title="The outbox could not be loaded" error={messages.error} onRetry={() => void messages.refetch()} retrying={messages.isFetching} />;
  }
  if (messages.data.length === 0) {
    return <EmptyPanel title="No e-mail yet">Invitations, password resets and delivery notices appear here as Compline sends them.</EmptyPanel>;
  }

  const count = (status: OutboxMessage['status']) => messages.data.filter((m) => m.status === status).length;
  return (
    <div className="flex flex-col gap-3">
      <p className="figures text-[0.8125rem] text-ink-faint">
        {countOf(messages.data.length, 'message')} · {count('sent')} sent · {count('queued')} queued · {count('failed')} failed
      </p>
      <ul className="overflow-hidden rounded-lg border border-rule bg-paper-raised">
        {messages.data.map((message) => (
          <li key={message.id} className="border-b border-rule last:border-b-0">
            <OutboxEntry message={message} />
          </li>
        ))}
      </ul>
    </div>
  );
}

function OutboxEntry({ message }: { message: OutboxMessage }) {
  const badge = statusBadge[message.status];
  return (
    <details className="group">
      <summary className="grid cursor-pointer list-none grid-cols-[1fr_auto] items-start gap-x-6 gap-y-1 px-5 py-3.5 hover:bg-paper [&::-webkit-details-marker]:hidden">
        <span className="flex min-w-0 items-start gap-3">
          <span aria-hidden className="figures mt-0.5 text-ink-faint transition-transform group-open:rotate-90">
            ›
          </span>
          <span className="min-w-0">
            <span className="block font-semibold text-ink">{message.subject}</span>
            <span className="block text-sm break-all text-ink-soft">To {message.toAddress}</span>
          </span>
        </span>
        <span className="flex flex-col items-end gap-1.5">
          <Badge tone={badge.tone}>{badge.label}</Badge>
          <span className="figures text-xs whitespace-nowrap text-ink-faint">{formatDateTime(message.sentAt ?? message.createdAt)}</span>
        </span>
      </summary>
      <div className="border-t border-dashed border-rule bg-paper px-5 py-4 sm:pl-11">
        <dl className="figures mb-3 flex flex-wrap gap-x-6 gap-y-1 text-xs text-ink-soft">
          <div>
            <dt className="inline text-ink-faint">Attempts </dt>
            <dd className="inline">{message.attempts}</dd>
          </div>
          <div>
            <dt className="inline text-ink-faint">Queued </dt>
            <dd className="inline">{formatDateTime(message.createdAt)}</dd>
          </div>
          {message.sentAt && (
            <div>
              <dt className="inline text-ink-faint">Sent </dt>
              <dd className="inline">{formatDateTime(message.sentAt)}</dd>
            </div>
          )}
        </dl>
        {message.lastError && <p className="mb-3 text-sm text-rust">Last error: {message.lastError}</p>}
        <pre className="max-h-96 overflow-auto text-[0.8125rem] leading-relaxed break-words whitespace-pre-wrap text-ink">{message.textBody}</pre>
      </div>
    </details>
  );
}
