import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { Order } from '@contracts/orders';
import { formatDateTime } from '../../../lib/format-date';
import { entryMark, nextStepWords, REPORT_DELIVERED, reportLinkOf, type EntryMark } from '../lib/order-words';

const markStyle: Record<EntryMark | 'next', string> = {
  done: 'border-ink bg-ink text-paper',
  good: 'border-teal bg-teal text-paper',
  bad: 'border-rust bg-paper-raised text-rust',
  progress: 'border-ink bg-paper-raised text-ink',
  next: 'border-dashed border-rule-strong bg-paper text-ink-faint',
};

const markGlyph: Record<EntryMark | 'next', string> = { done: '•', good: '✓', bad: '×', progress: '…', next: '' };

function Step({ mark, title, when, children, last }: { mark: EntryMark | 'next'; title: string; when?: ReactNode; children?: ReactNode; last: boolean }) {
  return (
    <li className="relative flex gap-3 pb-4 last:pb-0 md:flex-1 md:flex-col md:gap-2 md:pr-4 md:pb-0">
      {!last && (
        <span
          aria-hidden
          className={`absolute top-6 bottom-0 left-[11px] w-px md:top-[11px] md:right-0 md:bottom-auto md:left-6 md:h-px md:w-auto ${mark === 'next' ? 'bg-rule' : 'bg-rule-strong'}`}
        />
      )}
      <span aria-hidden className={`relative z-[1] flex size-6 shrink-0 items-center justify-center rounded-full border-2 text-[0.75rem] leading-none font-bold ${markStyle[mark]}`}>
        {markGlyph[mark]}
      </span>
      <div className="min-w-0">
        <p className={`text-[0.875rem] leading-snug font-semibold ${mark === 'next' ? 'text-ink-faint' : mark === 'bad' ? 'text-rust' : 'text-ink'}`}>{title}</p>
        {when && <p className="figures mt-0.5 text-[0.75rem] text-ink-faint">{when}</p>}
        {children}
      </div>
    </li>
  );
}

/**
 * Where an order stands: every step the server reports (placed, each payment attempt, the firm's
 * decision, then the work's progress in coarse words) and, greyed, the step that comes next.
 */
export function OrderTimeline({ order, viewer, payHref }: { order: Order; viewer: 'client' | 'firm'; payHref?: string }) {
  const next = nextStepWords(order, viewer);
  // The lender reads the report here; the firm's staff open the assignment instead.
  const reportLink = viewer === 'client' ? reportLinkOf(order) : null;
  const steps = order.timeline;
  return (
    <ol aria-label={`Timeline of order ${order.id}`} className="flex flex-col md:flex-row">
      {steps.map((entry, index) => (
        <Step
          key={`${entry.kind}-${index}`}
          mark={entryMark(entry)}
          title={entry.label}
          when={entry.at ? formatDateTime(entry.at) : undefined}
          last={index === steps.length - 1 && !next}
        >
          {entry.note && <p className="mt-1 max-w-72 text-[0.8125rem] leading-snug text-ink-soft">{entry.kind === 'declined' ? `Reason: ${entry.note}` : entry.note}</p>}
          {entry.kind === 'assignment' && entry.label === REPORT_DELIVERED && reportLink && (
            <Link to={reportLink.href} className="mt-1 inline-block text-[0.875rem] font-semibold text-ink underline decoration-ochre decoration-2 underline-offset-4 hover:decoration-ink">
              {reportLink.label}
            </Link>
          )}
        </Step>
      ))}
      {next && (
        <Step mark="next" title={next} last>
          {order.status === 'awaiting_payment' && payHref && (
            <Link to={payHref} className="mt-1 inline-block text-[0.875rem] font-semibold text-ink underline decoration-ochre decoration-2 underline-offset-4 hover:decoration-ink">
              Go to payment
            </Link>
          )}
        </Step>
      )}
    </ol>
  );
}
