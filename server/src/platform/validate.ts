/**
 * zod validation of params, query and body: errors say where (which part,
 * which field) and what was expected.
 */
import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';
import { HttpError, zodDetails } from './errors';

interface Schemas {
  params?: ZodType;
  query?: ZodType;
  body?: ZodType;
}

export function validate(schemas: Schemas): RequestHandler {
  return (req, _res, next) => {
    const details: ReturnType<typeof zodDetails> = [];
    for (const part of ['params', 'query', 'body'] as const) {
      const schema = schemas[part];
      if (!schema) continue;
      const parsed = schema.safeParse(req[part] ?? {});
      if (!parsed.success) details.push(...zodDetails(parsed.error, part));
      else if (part === 'query') Object.defineProperty(req, 'query', { value: parsed.data, writable: true, configurable: true });
      else (req as unknown as Record<string, unknown>)[part] = parsed.data;
    }
    if (details.length) {
      const first = details[0];
      const where = first.path ? `${first.location}.${first.path}` : first.location;
      return next(new HttpError(400, 'validation_failed', `Invalid ${where}: ${first.message}`, details));
    }
    next();
  };
}
