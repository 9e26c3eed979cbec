import { useState } from 'react';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { Link } from 'react-router-dom';
import type { Role } from '@contracts/auth';
import type { Order } from '@contracts/orders';
import { Button, buttonClasses } from '../../../components/ui/button';
import { SelectField, TextAreaField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { describeError, isApiError } from '../../../lib/api-error';
import { orderQueries, orderRequests } from '../api/order-queries';

/** Accept (it becomes an assignment) or decline (with the reason the client will read). An admin
 * picks the appraiser who will hold it; an appraiser accepts it for themselves. */
export function OrderDecision({ order, role }: { order: Order; role: Role }) {
  const queryClient = useQueryClient();
  const [open, setOpen] = useState<'accept' | 'decline' | null>(null);
  const [appraiserId, setAppraiserId] = useState('');
  const [reason, setReason] = useState('');
  const appraisers = useQuery({ ...orderQueries.appraisers(), enabled: role === 'admin' && open === 'accept' });
  const refresh = async () => {
    await queryClient.invalidateQueries({ queryKey: orderQueries.all() });
    // A new assignment now heads the appraiser's list (a key of the assignments feature).
    await queryClient.invalidateQueries({ queryKey: ['assignments'] });
  };
  const accept = useMutation({
    mutationFn: () => orderRequests.accept(order.id, { version: order.version, ...(role === 'admin' ? { appraiserUserId: Number(appraiserId) } : {}) }),
    onSuccess: refresh,
  });
  const decline = useMutation({ mutationFn: () => orderRequests.decline(order.id, { version: order.version, reason }), onSuccess: refresh });

  if (order.status === 'accepted') {
    return role === 'appraiser' && order.assignmentId ? (
      <Link to={`/assignments/${order.assignmentId}`} className={buttonClasses('secondary', 'sm')}>
        Open assignment {order.assignmentId}
      </Link>
    ) : (
      <p className="text-[0.875rem] text-ink-soft">
        Accepted as assignment <span className="figures">{order.assignmentId ?? '—'}</span>.
      </p>
    );
  }
  if (order.status === 'declined') return <p className="text-[0.875rem] text-ink-soft">Declined; the client has been told why.</p>;

  const canAccept = order.status === 'received';
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-2">
        {canAccept && (
          <Button size="sm" variant={open === 'accept' ? 'secondary' : 'primary'} onClick={() => setOpen(open === 'accept' ? null : 'accept')} aria-expanded={open === 'accept'}>
            Accept…
          </Button>
        )}
        <Button size="sm" variant="danger" onClick={() => setOpen(open === 'decline' ? null : 'decline')} aria-expanded={open === 'decline'}>
          Decline…
        </Button>
        {!canAccept && <span className="text-[0.875rem] text-ink-soft">It can be accepted once the client has paid.</span>}
      </div>

      {open === 'accept' && (
        <form
          aria-label={`Accept order ${order.id}`}
          className="flex max-w-xl flex-col gap-3"
          onSubmit={(event) => {
            event.preventDefault();
            accept.mutate();
          }}
        >
          {accept.isError && <Notice tone="error">{describeError(accept.error)}</Notice>}
          {role === 'admin' ? (
            <SelectField
              label="Appraiser who will hold the assignment"
              value={appraiserId}
              onChange={(event) => setAppraiserId(event.target.value)}
              disabled={appraisers.isPending}
              hint={appraisers.isError ? describeError(appraisers.error) : undefined}
            >
              <option value="">{appraisers.isPending ? 'Loading the appraisers…' : 'Choose an appraiser'}</option>
              {appraisers.data?.map((a) => (
                <option key={a.id} value={a.id}>
                  {a.name}
                </option>
              ))}
            </SelectField>
          ) : (
            <p className="text-[0.9375rem] text-ink-soft">You will hold the assignment. The client is told the order was accepted.</p>
          )}
          <Button type="submit" variant="primary" size="sm" className="self-start" disabled={role === 'admin' && !appraiserId} busy={accept.isPending} busyLabel="Accepting…">
            Accept the order
          </Button>
        </form>
      )}

      {open === 'decline' && (
        <form
          aria-label={`Decline order ${order.id}`}
          className="flex max-w-xl flex-col gap-3"
          onSubmit={(event) => {
            event.preventDefault();
            decline.mutate();
          }}
        >
          {decline.isError && <Notice tone="error">{describeError(decline.error)}</Notice>}
          <TextAreaField
            label="Reason for declining"
            hint="The client reads this in the e-mail and on the order."
            value={reason}
            onChange={(event) => setReason(event.target.value)}
            error={isApiError(decline.error) ? decline.error.fields?.reason : undefined}
          />
          <Button type="submit" variant="danger" size="sm" className="self-start" disabled={reason.trim().length < 3} busy={decline.isPending} busyLabel="Declining…">
            Decline the order
          </Button>
        </form>
      )}
    </div>
  );
}
