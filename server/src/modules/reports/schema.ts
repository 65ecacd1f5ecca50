/** Request shapes of the reports routes (the wire shapes are in shared/api/reports.ts). */
import { z } from 'zod';
import { reportChoiceSchema, type ReportChoice } from '@shared/api/reports';
import { HttpError } from '../../platform/errors';

const id = z.coerce.number().int().positive();

export const exerciseParamsSchema = z.object({ exerciseId: id });
export const reportParamsSchema = z.object({ reportId: id });
export const jobParamsSchema = z.object({ jobId: id });
export const onBehalfQuerySchema = z.object({ enrolmentId: id.optional() });

/** The multipart text field `choice`: JSON of a ReportChoice. */
export function choiceFromField(value: unknown, required: boolean): ReportChoice | undefined {
  if (value === undefined || value === null || value === '') {
    if (required) throw new HttpError(400, 'validation_failed', 'Send the confirmed column and unit choice in the field "choice".', [{ location: 'body', path: 'choice', message: 'Required' }]);
    return undefined;
  }
  let parsed: unknown;
  try {
    parsed = typeof value === 'string' ? JSON.parse(value) : value;
  } catch {
    throw new HttpError(400, 'validation_failed', 'The field "choice" is not valid JSON.', [{ location: 'body', path: 'choice', message: 'Expected JSON' }]);
  }
  const result = reportChoiceSchema.safeParse(parsed);
  if (!result.success) {
    const first = result.error.issues[0];
    const path = ['choice', ...first.path].join('.');
    throw new HttpError(
      400,
      'validation_failed',
      `Invalid body.${path}: ${first.message}`,
      result.error.issues.map((i) => ({ location: 'body', path: ['choice', ...i.path].join('.'), message: i.message })),
    );
  }
  return result.data;
}
