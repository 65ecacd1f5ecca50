/**
 * One error shape for every API answer: { error: { code, message, details } }.
 */
import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import type { ErrorCode } from '@shared/api/errors';

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

export const badRequest = (message: string, details?: unknown) => new HttpError(400, 'bad_request', message, details);
export const unauthenticated = (message = 'Sign in to continue.') => new HttpError(401, 'unauthenticated', message);
export const forbidden = (message = 'You do not have access to this.') => new HttpError(403, 'forbidden', message);
export const notFound = (message = 'Not found.') => new HttpError(404, 'not_found', message);
export const conflict = (message: string, details?: unknown) => new HttpError(409, 'conflict', message, details);

/** zod issues → a list of { path, message } a person can act on. */
export function zodDetails(error: ZodError, where: string) {
  return error.issues.map((i) => ({
    location: where,
    path: i.path.join('.'),
    message: i.message,
  }));
}

export function sendError(res: Parameters<RequestHandler>[1], err: HttpError) {
  res.status(err.status).json({ error: { code: err.code, message: err.message, ...(err.details === undefined ? {} : { details: err.details }) } });
}

/** Unknown API routes. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new HttpError(404, 'not_found', `No API route ${req.method} ${req.path}.`));
};

interface BodyParserError extends Error {
  type?: string;
  status?: number;
  body?: unknown;
}

/** The last middleware: every error becomes the one JSON shape. */
export const errorHandler: ErrorRequestHandler = (err, req, res, _next) => {
  if (res.headersSent) return;
  if (err instanceof HttpError) return sendError(res, err);
  if (err instanceof ZodError) return sendError(res, new HttpError(400, 'validation_failed', 'The request is not valid.', zodDetails(err, 'body')));
  const e = err as BodyParserError;
  if (e.type === 'entity.parse.failed') {
    return sendError(res, new HttpError(400, 'bad_request', `The request body is not valid JSON: ${e.message}`));
  }
  if (e.type === 'entity.too.large') {
    return sendError(res, new HttpError(413, 'payload_too_large', 'The request body is too large.'));
  }
  if (e.type === 'charset.unsupported' || e.type === 'encoding.unsupported') {
    return sendError(res, new HttpError(415, 'unsupported_media_type', e.message));
  }
  req.log?.error({ err }, 'unhandled error');
  sendError(res, new HttpError(500, 'internal', 'Something went wrong on our side. The error has been logged.'));
};
