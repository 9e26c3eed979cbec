import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useFieldArray, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { TextAreaField } from '../../../components/ui/field';
import { describeError } from '../../../lib/api-error';
import { reconsiderationQueries, reconsiderationRequests } from '../api/reconsideration-queries';
import { blankSale, MAX_EXTRA_SALES, reconsiderationFormSchema, type ReconsiderationFormOutput, type ReconsiderationFormValues } from '../lib/reconsideration-form';
import { ExtraSaleFields } from './extra-sale-fields';

/** The client's request for a reconsideration of value: what they ask and why, with up to five
 * sales the appraiser may not have weighed. Each sale is checked with the same rules as the firm's
 * own sale form before anything is sent. */
export function ReconsiderationForm({ reportVersionId, unit, onDone }: { reportVersionId: number; unit: string; onDone: (sent: boolean) => void }) {
  const queryClient = useQueryClient();
  const form = useForm<ReconsiderationFormValues, unknown, ReconsiderationFormOutput>({
    resolver: zodResolver(reconsiderationFormSchema),
    defaultValues: { comment: '', sales: [] },
  });
  const sales = useFieldArray({ control: form.control, name: 'sales' });
  const { errors } = form.formState;
  const file = useMutation({
    mutationFn: (body: ReconsiderationFormOutput) => reconsiderationRequests.file(reportVersionId, body),
    onSuccess: async () => {
      await queryClient.invalidateQueries({ queryKey: reconsiderationQueries.all() });
      form.reset({ comment: '', sales: [] });
      onDone(true);
    },
  });

  return (
    <form onSubmit={form.handleSubmit((values) => file.mutate(values))} noValidate className="flex flex-col gap-5" aria-label="Ask for a reconsideration of value">
      {file.isError && <Notice tone="error" title="The request was not sent">{describeError(file.error)}</Notice>}
      <TextAreaField
        label="What should the appraiser reconsider, and why?"
        rows={4}
        hint="Point to facts: a sale that was missed, a feature of the subject, a figure you believe is wrong."
        error={errors.comment?.message}
        {...form.register('comment')}
      />
      <div className="flex flex-col gap-3">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h3 className="text-[0.9375rem] font-semibold text-ink">Extra sales ({sales.fields.length} of up to {MAX_EXTRA_SALES})</h3>
          <p className="text-[0.8125rem] text-ink-soft">Optional. Closed sales only, with their source.</p>
        </div>
        {sales.fields.map((field, index) => (
          <ExtraSaleFields key={field.id} index={index} register={form.register} errors={errors.sales} onRemove={() => sales.remove(index)} unit={unit} />
        ))}
        {errors.sales?.root?.message && <p className="text-[0.8125rem] font-medium text-rust">{errors.sales.root.message}</p>}
        <Button size="sm" className="self-start" disabled={sales.fields.length >= MAX_EXTRA_SALES} onClick={() => sales.append(blankSale())}>
          Add an extra sale
        </Button>
      </div>
      <div className="flex flex-wrap items-center gap-3 border-t border-rule pt-4">
        <Button type="submit" variant="primary" busy={file.isPending} busyLabel="Sending…">
          Send the request
        </Button>
        <Button variant="quiet" onClick={() => onDone(false)}>
          Cancel
        </Button>
        <p className="text-[0.8125rem] text-ink-soft">The appraiser is e-mailed and answers here; the signed version stays as it is.</p>
      </div>
    </form>
  );
}
