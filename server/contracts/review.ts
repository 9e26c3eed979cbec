import { z } from 'zod';
import { assignmentStatuses } from './assignments';

export const workflowActions = ['submit', 'request-revisions', 'approve'] as const;
export type WorkflowAction = (typeof workflowActions)[number];
export const transitionRequest = z.object({
  action: z.enum(workflowActions),
  version: z.number().int().positive(),
  note: z.string().trim().max(4000).optional(),
});

export const raiseQueryRequest = z.object({
  saleId: z.number().int().positive().nullable(),
  body: z.string().trim().min(1, 'Write the question.').max(4000),
});
export const queryMessageRequest = z.object({ body: z.string().trim().min(1, 'Write a message.').max(4000) });
export const answerQueryRequest = z.object({
  action: z.enum(['keep', 'exclude']),
  explanation: z.string().trim().min(3, 'Explain why, from the facts of the sale.').max(4000),
  version: z.number().int().positive(),
});
export const queryStateRequest = z.object({ version: z.number().int().positive(), body: z.string().trim().max(4000).optional() });

export const queryMessageSchema = z.object({
  id: z.number().int(),
  authorName: z.string(),
  authorRole: z.string(),
  kind: z.enum(['question', 'comment', 'kept', 'excluded', 'resolved', 'reopened']),
  body: z.string(),
  createdAt: z.coerce.date(),
});
export const reviewQuerySchema = z.object({
  id: z.number().int(),
  assignmentId: z.number().int(),
  saleId: z.number().int().nullable(),
  saleAddress: z.string().nullable(),
  status: z.enum(['open', 'answered', 'resolved']),
  raisedByName: z.string(),
  version: z.number().int(),
  createdAt: z.coerce.date(),
  messages: z.array(queryMessageSchema),
});
export type ReviewQuery = z.infer<typeof reviewQuerySchema>;
export const queryListResponse = z.object({ queries: z.array(reviewQuerySchema) });

export const timelineResponse = z.object({
  changes: z.array(z.object({ id: z.number().int(), fromStatus: z.enum(assignmentStatuses).nullable(), toStatus: z.enum(assignmentStatuses), byName: z.string(), note: z.string().nullable(), at: z.coerce.date() })),
});

export const reviewQueueResponse = z.object({
  items: z.array(
    z.object({
      id: z.number().int(),
      subjectAddress: z.string(),
      appraiserName: z.string(),
      clientOrganisationName: z.string(),
      status: z.enum(assignmentStatuses),
      dueDate: z.string().nullable(),
      openQueries: z.number().int(),
      flaggedSales: z.number().int(),
      updatedAt: z.coerce.date(),
    }),
  ),
});

/** The answer of POST /api/assignments/:id/transitions: the assignment's new status and version. */
export const transitionResponse = z.object({ status: z.enum(assignmentStatuses), version: z.number().int() });
export type TransitionResponse = z.infer<typeof transitionResponse>;

/** The answer of a write that has nothing to report but that it happened. */
export const okResponse = z.object({ ok: z.literal(true) });
export type OkResponse = z.infer<typeof okResponse>;
