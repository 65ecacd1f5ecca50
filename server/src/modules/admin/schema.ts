import { z } from 'zod';

export const auditQuerySchema = z.object({
  limit: z.coerce.number().int().min(1).max(500).default(50),
  before: z.coerce.number().int().positive().optional(),
});
