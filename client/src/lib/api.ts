/**
 * The client's one way to talk to the Bondmark API.
 *
 * - Same-origin relative URLs (/api/v1/..., /auth/...), cookies sent with
 *   `credentials: 'same-origin'`.
 * - Every failure becomes an ApiError (status, code, message, details) parsed
 *   from the server's `{ error: { code, message, details } }` shape.
 * - POST/PUT/PATCH/DELETE carry `x-csrf-token`. The token is fetched once from
 *   GET /api/v1/csrf-token and kept in the query client; when the server
 *   answers 403 `csrf_failed` (e.g. the session changed after sign-in) the
 *   token is fetched again and the request retried once.
 */
import { queryOptions } from '@tanstack/react-query';
import { ApiError } from './api-error';
import { queryClient } from './query-client';

export { ApiError, isApiError } from './api-error';

export type HttpMethod = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export interface ApiRequest {
  method?: HttpMethod;
  /** A plain value is sent as JSON; FormData (uploads) is sent as multipart. */
  body?: unknown;
  signal?: AbortSignal;
  /** Search parameters appended to the path; undefined and null values are left out. */
  query?: Record<string, string | number | boolean | null | undefined>;
}

export const CSRF_HEADER = 'x-csrf-token';

export const csrfTokenQueryOptions = () =>
  queryOptions({
    queryKey: ['session', 'csrf-token'] as const,
    queryFn: ({ signal }) => apiFetch<{ token: string }>('/api/v1/csrf-token', { signal }),
    staleTime: Infinity,
    gcTime: Infinity,
    retry: false,
  });

async function csrfToken(fresh: boolean): Promise<string> {
  const options = csrfTokenQueryOptions();
  if (fresh) queryClient.removeQueries({ queryKey: options.queryKey, exact: true });
  const { token } = await queryClient.fetchQuery(options);
  return token;
}

/** Adds `query` to `path` as search parameters. */
export function withQuery(path: string, query: ApiRequest['query']): string {
  if (!query) return path;
  const params = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null) continue;
    params.set(key, String(value));
  }
  const search = params.toString();
  if (!search) return path;
  return `${path}${path.includes('?') ? '&' : '?'}${search}`;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** Turns a failed response into an ApiError, whatever the server sent. */
export async function errorFromResponse(response: Response): Promise<ApiError> {
  let payload: unknown;
  try {
    payload = await response.json();
  } catch {
    payload = undefined;
  }
  if (isRecord(payload) && isRecord(payload.error) && typeof payload.error.code === 'string') {
    const { code, message, details } = payload.error;
    return new ApiError(
      response.status,
      code,
      typeof message === 'string' && message ? message : `Request failed (${response.status}).`,
      details,
    );
  }
  return new ApiError(
    response.status,
    response.status === 401 ? 'unauthenticated' : 'unexpected_response',
    `The server answered ${response.status}${response.statusText ? ` ${response.statusText}` : ''}.`,
  );
}

async function bodyOf<T>(response: Response): Promise<T> {
  if (response.status === 204 || response.status === 205) return undefined as T;
  const text = await response.text();
  if (!text) return undefined as T;
  try {
    return JSON.parse(text) as T;
  } catch {
    throw new ApiError(response.status, 'unexpected_response', 'The server answered something that is not JSON.');
  }
}

async function send(path: string, request: ApiRequest, token: string | undefined): Promise<Response> {
  const method = request.method ?? 'GET';
  const headers: Record<string, string> = { accept: 'application/json' };
  let body: BodyInit | undefined;
  if (request.body instanceof FormData) {
    body = request.body;
  } else if (request.body !== undefined) {
    headers['content-type'] = 'application/json';
    body = JSON.stringify(request.body);
  }
  if (token !== undefined) headers[CSRF_HEADER] = token;
  try {
    return await fetch(withQuery(path, request.query), {
      method,
      headers,
      body,
      credentials: 'same-origin',
      signal: request.signal,
    });
  } catch (error) {
    if (error instanceof DOMException && error.name === 'AbortError') throw error;
    throw new ApiError(0, 'network_error', 'Bondmark could not be reached. Check the connection and try again.');
  }
}

/**
 * Calls the API and returns the parsed JSON body; throws ApiError on any
 * non-2xx answer or network failure.
 */
export async function apiFetch<T>(path: string, request: ApiRequest = {}): Promise<T> {
  const unsafe = (request.method ?? 'GET') !== 'GET';
  let response = await send(path, request, unsafe ? await csrfToken(false) : undefined);
  if (unsafe && response.status === 403) {
    const error = await errorFromResponse(response);
    if (error.code !== 'csrf_failed') throw error;
    response = await send(path, request, await csrfToken(true));
  }
  if (!response.ok) throw await errorFromResponse(response);
  return bodyOf<T>(response);
}

export const apiGet = <T>(path: string, request: Omit<ApiRequest, 'method' | 'body'> = {}) =>
  apiFetch<T>(path, { ...request, method: 'GET' });

export const apiPost = <T>(path: string, body?: unknown, request: Omit<ApiRequest, 'method' | 'body'> = {}) =>
  apiFetch<T>(path, { ...request, method: 'POST', body });
