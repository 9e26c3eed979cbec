import type { ReviewQuery } from '@contracts/review';
import { EmptyPanel } from '../../../components/ui/query-states';
import { QueryThread, type ThreadPermissions } from './query-thread';

const order: Record<ReviewQuery['status'], number> = { open: 0, answered: 1, resolved: 2 };

/** Every query of the assignment: the ones still waiting on someone first, then the resolved. */
export function QueryThreads({ assignmentId, queries, permissions, onSaleChanged }: { assignmentId: number; queries: readonly ReviewQuery[]; permissions: ThreadPermissions; onSaleChanged: () => Promise<unknown> }) {
  if (queries.length === 0) {
    return (
      <EmptyPanel title="No queries yet">
        {permissions.role === 'reviewer' ? 'Raise one on a flagged sale above, or on the assignment as a whole.' : 'The reviewer’s questions on the sales appear here for you to answer.'}
      </EmptyPanel>
    );
  }
  const sorted = [...queries].sort((a, b) => order[a.status] - order[b.status] || a.id - b.id);
  return (
    <div className="flex flex-col gap-4">
      {sorted.map((query) => (
        <QueryThread key={query.id} assignmentId={assignmentId} query={query} permissions={permissions} onSaleChanged={onSaleChanged} />
      ))}
    </div>
  );
}
