import { z } from 'zod';
import { staffRoleSchema } from '@shared/api/courses';

const id = z.coerce.number().int().positive();

export const courseParamsSchema = z.object({ courseId: id });
export const staffParamsSchema = z.object({ courseId: id, userId: id, role: staffRoleSchema });
