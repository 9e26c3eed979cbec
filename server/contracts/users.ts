import { z } from 'zod';
import { emailField, roleSchema, sessionUserSchema } from './auth';

export const teamMemberSchema = sessionUserSchema.extend({ active: z.boolean(), version: z.number().int(), createdAt: z.coerce.date() });
export type TeamMember = z.infer<typeof teamMemberSchema>;
export const teamResponse = z.object({ users: z.array(teamMemberSchema) });

export const organisationSchema = z.object({ id: z.number().int(), name: z.string(), kind: z.enum(['firm', 'lender']) });
export type Organisation = z.infer<typeof organisationSchema>;
export const organisationsResponse = z.object({ organisations: z.array(organisationSchema) });

export const inviteRequest = z.object({
  email: emailField,
  name: z.string().trim().min(1, 'Enter the person’s name.').max(120),
  role: roleSchema,
  organisationId: z.number().int().positive(),
});

export const updateUserRequest = z.object({
  version: z.number().int().positive(),
  role: roleSchema.optional(),
  active: z.boolean().optional(),
});

export const outboxMessageSchema = z.object({
  id: z.number().int(),
  toAddress: z.string(),
  subject: z.string(),
  textBody: z.string(),
  status: z.enum(['queued', 'sent', 'failed']),
  attempts: z.number().int(),
  lastError: z.string().nullable(),
  createdAt: z.coerce.date(),
  sentAt: z.coerce.date().nullable(),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxResponse = z.object({ messages: z.array(outboxMessageSchema) });

export const auditEventSchema = z.object({
  id: z.number(),
  at: z.coerce.date(),
  actorName: z.string().nullable(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string(),
  details: z.record(z.string(), z.unknown()),
});
export const auditResponse = z.object({ events: z.array(auditEventSchema) });
