import { z } from 'zod';

export const roles = ['appraiser', 'reviewer', 'client', 'admin'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  appraiser: 'Appraiser',
  reviewer: 'Review appraiser',
  client: 'Lender client',
  admin: 'Office manager',
};

export const sessionUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  name: z.string(),
  role: roleSchema,
  organisationId: z.number().int(),
  organisationName: z.string(),
  organisationKind: z.enum(['firm', 'lender']),
});
export type SessionUser = z.infer<typeof sessionUserSchema>;

export const meResponse = z.object({ user: sessionUserSchema });

export const emailField = z.string().trim().toLowerCase().email('Enter a valid e-mail address.').max(254);
export const newPasswordField = z
  .string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.');

export const signInRequest = z.object({
  email: emailField,
  password: z.string().min(1, 'Enter your password.').max(200),
});

export const passwordResetRequest = z.object({ email: emailField });
export const passwordResetConfirm = z.object({ token: z.string().min(20).max(200), password: newPasswordField });
export const invitationAccept = z.object({ token: z.string().min(20).max(200), password: newPasswordField });
export const invitationPreview = z.object({ email: z.string(), name: z.string(), role: roleSchema, organisationName: z.string() });
