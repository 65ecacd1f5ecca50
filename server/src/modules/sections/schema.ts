import { z } from 'zod';

const id = z.coerce.number().int().positive();
export const sectionsParamsSchema = z.object({ courseId: id });
export const sectionParamsSchema = z.object({ courseId: id, sectionId: id });
