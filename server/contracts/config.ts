import { z } from 'zod';

export const configResponse = z.object({ mapStyleUrl: z.string().url().nullable() });
