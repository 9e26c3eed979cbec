import { z } from 'zod';
import { newPasswordField } from '@contracts/auth';

/** A new password typed twice (reset and invitation pages). The rules are the server's own. */
export const newPasswordForm = z
  .object({ password: newPasswordField, confirm: z.string() })
  .refine((values) => values.password === values.confirm, { message: 'The two passwords are not the same.', path: ['confirm'] });

export type NewPasswordForm = z.infer<typeof newPasswordForm>;
