import { z } from 'zod';

/** The one error shape every API route answers with. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    details: z.unknown().optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

/** Error codes the server uses; the client may switch on them. */
export const errorCodes = [
  'bad_request',
  'validation_failed',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  'payload_too_large',
  'unsupported_media_type',
  'csrf_failed',
  'rate_limited',
  'internal',
] as const;
export type ErrorCode = (typeof errorCodes)[number];
