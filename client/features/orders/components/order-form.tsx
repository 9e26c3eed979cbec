import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { Fee, Order } from '@contracts/orders';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/field';
import { Notice } from '../../../components/ui/notice';
import { EmptyPanel, ErrorPanel, LoadingPanel } from '../../../components/ui/query-states';
import { describeError } from '../../../lib/api-error';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { orderQueries, orderRequests } from '../api/order-queries';
import { blankOrderForm, dayFromToday, orderFormFields, orderFormSchema, type OrderFormOutput, type OrderFormValues } from '../lib/order-form';
import { FeeChoice } from './fee-choice';

/** Step one of an order: the subject, the use, the loan, the due date and the fee. Placing it
 * creates the order unpaid; the payment step follows on the order's own page. */
export function OrderForm({ onPlaced }: { onPlaced: (order: Order) => void }) {
  const fees = useQuery(orderQueries.fees());
  if (fees.isPending) return <LoadingPanel label="Loading the fee lists…" />;
  if (fees.isError) return <ErrorPanel title="The fee lists could not be loaded" error={fees.error} onRetry={() => void fees.refetch()} retrying={fees.isFetching} />;
  if (fees.data.length === 0) return <EmptyPanel title="No appraisal firm lists a fee yet">An order needs a fee from a firm’s list.</EmptyPanel>;
  return <OrderFormFields fees={fees.data} onPlaced={onPlaced} />;
}

function OrderFormFields({ fees, onPlaced }: { fees: readonly Fee[]; onPlaced: (order: Order) => void }) {
  const queryClient = useQueryClient();
  const form = useForm<OrderFormValues, unknown, OrderFormOutput>({ resolver: zodResolver(orderFormSchema), defaultValues: blankOrderForm() });
  const { errors } = form.formState;
  const feeId = useWatch({ control: form.control, name: 'feeId' });
  const place = useMutation({
    mutationFn: orderRequests.place,
    onSuccess: async ({ order }) => {
      queryClient.setQueryData(orderQueries.detail(order.id).queryKey, (old) => old ?? { order, payments: [] });
      await queryClient.invalidateQueries({ queryKey: orderQueries.list().queryKey });
      onPlaced(order);
    },
  });
  const onSubmit = form.handleSubmit((values) =>
    place.mutate(values, { onError: (error) => applyServerFieldErrors(error, form.setError, orderFormFields) }),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-6">
      {place.isError && <Notice tone="error" title="The order was not placed">{describeError(place.error)}</Notice>}
      <section className="grid gap-5 md:grid-cols-2" aria-label="The property and the loan">
        <div className="md:col-span-2">
          <TextField label="Subject address" autoComplete="off" placeholder="Street, number and town" error={errors.subjectAddress?.message} {...form.register('subjectAddress')} />
        </div>
        <div className="md:col-span-2">
          <TextField label="Intended use" hint="What the lender will use the opinion of value for." error={errors.intendedUse?.message} {...form.register('intendedUse')} />
        </div>
        <TextField label="Loan reference" autoComplete="off" className="figures" error={errors.loanReference?.message} {...form.register('loanReference')} />
        <TextField label="Report due by" type="date" min={dayFromToday(0)} className="figures" error={errors.dueDate?.message} {...form.register('dueDate')} />
      </section>
      <FeeChoice fees={fees} field={form.register('feeId')} selectedFeeId={feeId} error={errors.feeId?.message} onFirmChange={() => form.setValue('feeId', '')} />
      <div className="flex flex-wrap items-center gap-4 border-t border-rule pt-5">
        <Button type="submit" variant="primary" busy={place.isPending} busyLabel="Placing the order…">
          Continue to payment
        </Button>
        <p className="text-[0.875rem] text-ink-soft">Nothing is charged until you confirm the card on the next step.</p>
      </div>
    </form>
  );
}
