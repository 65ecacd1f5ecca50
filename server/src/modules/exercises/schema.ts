import { z } from 'zod';

const id = z.coerce.number().int().positive();

export const courseParamsSchema = z.object({ courseId: id });
export const exerciseParamsSchema = z.object({ id });
export const answerKeyQuerySchema = z.object({ revision: z.coerce.number().int().positive().optional() });
