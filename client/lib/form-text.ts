import { z } from 'zod';

/** Form inputs hold text: these turn it into a contract's values, then check them with the
 * contract's own rule and message. Spaces and thousands separators are allowed in numbers. */
const cleanNumber = (text: string) => Number(text.replace(/[\s,]/g, ''));

/** Text → number (blank → null), then the contract's rule for that field. */
export function numberText<T extends z.ZodType<unknown, number | null>>(rule: T) {
  return z
    .string()
    .trim()
    .refine((text) => text === '' || Number.isFinite(cleanNumber(text)), 'Enter a number.')
    .transform((text) => (text === '' ? null : cleanNumber(text)))
    .pipe(rule);
}

/** Text → text (blank → null), then the contract's rule. */
export function optionalText<T extends z.ZodType<unknown, string | null>>(rule: T) {
  return z
    .string()
    .trim()
    .transform((text) => (text === '' ? null : text))
    .pipe(rule);
}
