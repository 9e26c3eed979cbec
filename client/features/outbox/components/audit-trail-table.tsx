import { useQuery } from '@tanstack/react-query';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { Table, Td, Th } from '../../../components/ui/table';
import { formatDateTime } from '../../../lib/format-date';
import { humaniseCode } from '../../../lib/humanise';
import { outboxQueries } from '../api/outbox-queries';

/** 'role: appraiser' style pairs; nested values as compact JSON. */
function detailPairs(details: Record<string, unknown>): Array<[string, string]> {
  return Object.entries(details).map(([key, value]) => [key, typeof value === 'string' || typeof value === 'number' ? String(value) : JSON.stringify(value)]);
}

/** Who did what and when, newest first (the server keeps the latest 300 here). */
export function AuditTrailTable() {
  const events = useQuery(outboxQueries.auditTrail());

  if (events.isPending) return <LoadingPanel label="Loading the audit trail…" />;
  if (events.isError) {
    return <ErrorPanel title="The audit trail could not be loaded" error={events.error} onRetry={() => void events.refetch()} retrying={events.isFetching} />;
  }
  if (events.data.length === 0) return <EmptyPanel title="Nothing recorded yet">Sign-ins and every change to records are listed here.</EmptyPanel>;

  return (
    <Table caption="Audit trail">
      <thead>
        <tr>
          <Th>When</Th>
          <Th>Who</Th>
          <Th>What</Th>
          <Th>Record</Th>
          <Th>Details</Th>
        </tr>
      </thead>
      <tbody>
        {events.data.map((event) => (
          <tr key={event.id} className="hover:bg-paper">
            <Td className="figures text-[0.8125rem] whitespace-nowrap text-ink-soft">{formatDateTime(event.at)}</Td>
            <Td className="whitespace-nowrap">{event.actorName ?? <span className="text-ink-faint">System</span>}</Td>
            <Td className="font-medium">{humaniseCode(event.action)}</Td>
            <Td className="figures text-[0.8125rem] whitespace-nowrap text-ink-soft">
              {event.entityType} #{event.entityId}
            </Td>
            <Td>
              <dl className="figures flex flex-wrap gap-x-4 gap-y-0.5 text-xs text-ink-soft">
                {detailPairs(event.details).map(([key, value]) => (
                  <div key={key} className="max-w-full break-all">
                    <dt className="inline text-ink-faint">{key} </dt>
                    <dd className="inline">{value}</dd>
                  </div>
                ))}
              </dl>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
