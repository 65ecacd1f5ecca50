import { z } from 'zod';
import { rosterMappingSchema } from '@shared/api/roster';

const id = z.coerce.number().int().positive();
export const rosterParamsSchema = z.object({ courseId: id });
export const enrolmentParamsSchema = z.object({ courseId: id, enrolmentId: id });

/** Multipart text fields next to the file: `mapping` as JSON, `sha256` of the previewed file. */
const mappingField = z
  .string()
  .transform((s, ctx) => {
    try {
      return JSON.parse(s) as unknown;
    } catch {
      ctx.addIssue({ code: 'custom', message: 'mapping must be JSON, e.g. {"studentNumber":0,"familyName":1,"givenName":2,"email":3,"section":null}.' });
      return z.NEVER;
    }
  })
  .pipe(rosterMappingSchema);

export const previewFieldsSchema = z.object({ mapping: mappingField.optional() });
export const applyFieldsSchema = z.object({
  mapping: mappingField,
  sha256: z.string().regex(/^[0-9a-fA-F]{64}$/, 'sha256 is the 64 hex digits the preview answered.').optional(),
});
