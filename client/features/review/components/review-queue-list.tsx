import { useQuery } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import type { z } from 'zod';
import { statusLabels } from '@contracts/assignments';
import type { reviewQueueResponse } from '@contracts/review';
import { Badge } from '../../../components/ui/badge';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { Table, Td, Th } from '../../../components/ui/table';
import { countOf } from '../../../lib/count-of';
import { formatDateTime, formatIsoDate } from '../../../lib/format-date';
import { reviewQueries } from '../api/review-queries';

type Item = z.infer<typeof reviewQueueResponse>['items'][number];

/** In review before returned for revisions; then the ones with more flagged sales, then the longest waiting. */
function queueOrder(a: Item, b: Item): number {
  return Number(b.status === 'in_review') - Number(a.status === 'in_review') || b.flaggedSales - a.flaggedSales || a.updatedAt.getTime() - b.updatedAt.getTime();
}

/** Assignments waiting on a reviewer: in review first, the ones with more flagged sales first,
 * each with its flagged-sale and open-query counts. */
export function ReviewQueueList() {
  const queue = useQuery({ ...reviewQueries.queue(), refetchInterval: 60_000 });

  if (queue.isPending) return <LoadingPanel label="Loading the review queue…" />;
  if (queue.isError) {
    return <ErrorPanel title="The review queue could not be loaded" error={queue.error} onRetry={() => void queue.refetch()} retrying={queue.isFetching} />;
  }
  if (queue.data.length === 0) {
    return <EmptyPanel title="Nothing waits for review">Assignments appear here when an appraiser submits them.</EmptyPanel>;
  }
  const rows = [...queue.data].sort(queueOrder);
  const inReview = rows.filter((r) => r.status === 'in_review').length;
  const returned = rows.length - inReview;
  const openQueries = rows.reduce((t, r) => t + r.openQueries, 0);
  return (
    <div className="flex flex-col gap-3">
      <p className="text-[0.9375rem] text-ink-soft" data-testid="queue-summary">
        <span className="font-semibold text-ink">{countOf(inReview, 'file')} in review</span>
        {returned > 0 && <> · {countOf(returned, 'file')} back with the appraiser</>} · {countOf(openQueries, 'query', 'queries')} not yet resolved
      </p>
      <Table caption="Assignments waiting for review">
        <thead>
          <tr>
            <Th>Subject</Th>
            <Th>Appraiser</Th>
            <Th>Status</Th>
            <Th className="text-right">Flagged sales</Th>
            <Th className="text-right">Open queries</Th>
            <Th className="text-right">Due</Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((item) => (
            <tr key={item.id} className={item.status === 'in_review' ? 'hover:bg-paper' : 'bg-paper-sunk/30 hover:bg-paper'}>
              <Td>
                <Link to={`/assignments/${item.id}/review`} className="font-semibold text-ink underline decoration-rule-strong underline-offset-4 hover:decoration-ink">
                  {item.subjectAddress}
                </Link>
                <p className="text-[0.8125rem] text-ink-faint">
                  For {item.clientOrganisationName} · <span className="figures">updated {formatDateTime(item.updatedAt)}</span>
                </p>
              </Td>
              <Td className="text-ink-soft">{item.appraiserName}</Td>
              <Td>
                <Badge tone={item.status === 'in_review' ? 'pending' : 'negative'}>{statusLabels[item.status]}</Badge>
              </Td>
              <Td className="figures text-right">
                <span className="inline-flex items-center gap-2" aria-label={countOf(item.flaggedSales, 'flagged sale')}>
                  {item.flaggedSales > 0 && <span aria-hidden className="inline-block size-3 rounded-full border-2 border-flag-ring" />}
                  {item.flaggedSales}
                </span>
              </Td>
              <Td className={`figures text-right ${item.openQueries > 0 ? 'font-semibold text-ink' : 'text-ink-faint'}`}>{item.openQueries}</Td>
              <Td className="figures text-right text-sm whitespace-nowrap">{item.dueDate ? formatIsoDate(item.dueDate) : '—'}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </div>
  );
}
