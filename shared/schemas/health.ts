import { z } from 'zod';

export const healthSchema = z.object({
  status: z.enum(['ok', 'error']),
  db: z.enum(['ok', 'unreachable']),
});
export type Health = z.infer<typeof healthSchema>;
