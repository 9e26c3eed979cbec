import { z } from 'zod';
import { saleCreate } from './sales';

export const reconsiderationRequest = z.object({
  comment: z.string().trim().min(10, 'Explain what the client asks to be reconsidered.').max(4000),
  sales: z.array(saleCreate).max(5, 'Up to five extra sales.'),
});

export const reconsiderationResponseRequest = z.object({
  decision: z.enum(['keep-value', 'revise']),
  response: z.string().trim().min(10, 'Give the reasons for the decision.').max(4000),
  version: z.number().int().positive(),
});

export const reconsiderationSchema = z.object({
  id: z.number().int(),
  reportVersionId: z.number().int(),
  assignmentId: z.number().int(),
  requestedByName: z.string(),
  comment: z.string(),
  extraSales: z.array(z.record(z.string(), z.unknown())),
  status: z.enum(['open', 'value_kept', 'new_version']),
  response: z.string().nullable(),
  version: z.number().int(),
  createdAt: z.coerce.date(),
  respondedAt: z.coerce.date().nullable(),
  /** The subject neighbourhood's fit before and with the extra sales (firm view only). */
  effect: z
    .object({
      neighbourhood: z.string(),
      before: z.object({ n: z.number().int(), slope: z.number().nullable(), rSquared: z.number().nullable(), estimate: z.number().nullable() }),
      withExtra: z.object({ n: z.number().int(), slope: z.number().nullable(), rSquared: z.number().nullable(), estimate: z.number().nullable() }),
    })
    .nullable(),
});
export type Reconsideration = z.infer<typeof reconsiderationSchema>;

export const reconsiderationListResponse = z.object({ reconsiderations: z.array(reconsiderationSchema) });
export type ReconsiderationListResponse = z.infer<typeof reconsiderationListResponse>;

/** The answer of POST /api/reports/:id/reconsiderations. */
export const reconsiderationFiledResponse = z.object({ id: z.number().int() });
