import { z } from 'zod';

/** Parse a value with a contract; a ZodError becomes a 400 with field messages in the error handler. */
export function parse<T extends z.ZodType>(schema: T, value: unknown): z.infer<T> {
  return schema.parse(value);
}

export const idParam = z.object({ id: z.coerce.number().int().positive().max(2_147_483_647) });

export function parseId(params: unknown): number {
  return idParam.parse(params).id;
}
