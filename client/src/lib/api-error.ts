/**
 * An error answered by the Bondmark API ({ error: { code, message, details } }),
 * or one made up on the client when the server could not be reached
 * (status 0, code 'network_error') or answered something that is not our shape
 * (code 'unexpected_response').
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly details: unknown;

  constructor(status: number, code: string, message: string, details?: unknown) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}
