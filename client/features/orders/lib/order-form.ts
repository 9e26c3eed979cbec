import { z } from 'zod';
import { orderInput } from '@contracts/orders';

/**
 * The order form holds text, as inputs do; the fee arrives as the value of a radio button. The
 * contract's own rules and messages (`orderInput` in @contracts/orders) check everything else.
 */
export const orderFormSchema = orderInput.extend({
  feeId: z
    .string()
    .min(1, 'Pick the fee for this appraisal.')
    .transform((text) => Number(text))
    .pipe(orderInput.shape.feeId),
});

export type OrderFormValues = z.input<typeof orderFormSchema>;
export type OrderFormOutput = z.output<typeof orderFormSchema>;
export const orderFormFields = ['subjectAddress', 'intendedUse', 'loanReference', 'dueDate', 'feeId'] as const satisfies readonly (keyof OrderFormValues)[];

/** A calendar day `days` from today in the reader's time zone, as YYYY-MM-DD. */
export function dayFromToday(days: number, now = new Date()): string {
  const day = new Date(now.getFullYear(), now.getMonth(), now.getDate() + days);
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${day.getFullYear()}-${pad(day.getMonth() + 1)}-${pad(day.getDate())}`;
}

export const blankOrderForm = (): OrderFormValues => ({
  subjectAddress: '',
  intendedUse: 'Mortgage lending decision for a purchase loan (first lien)',
  loanReference: '',
  dueDate: dayFromToday(14),
  feeId: '',
});
