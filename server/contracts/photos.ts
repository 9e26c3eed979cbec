import { z } from 'zod';

export const photoSchema = z.object({
  id: z.number().int(),
  assignmentId: z.number().int(),
  saleId: z.number().int().nullable(),
  width: z.number().int(),
  height: z.number().int(),
  originalName: z.string(),
  createdAt: z.coerce.date(),
});
export type Photo = z.infer<typeof photoSchema>;
export const photoListResponse = z.object({ photos: z.array(photoSchema) });
export const photoSizes = ['thumb', 'display'] as const;
export const photoUrl = (id: number, size: (typeof photoSizes)[number]) => `/api/photos/${id}/${size}`;
