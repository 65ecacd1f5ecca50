import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ApiError, apiFetch, apiGet, apiPost, withQuery } from '@client/lib/api';
import { queryClient } from '@client/lib/query-client';

type Call = { url: string; init: RequestInit };

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } });
}

/** A fake server: answers each request with the next function in `script` for its path. */
function fakeFetch(routes: Record<string, Array<(call: Call) => Response>>) {
  const calls: Call[] = [];
  const fn = vi.fn(async (input: RequestInfo | URL, init: RequestInit = {}) => {
    const url = String(input);
    calls.push({ url, init });
    const path = url.split('?')[0];
    const queue = routes[path];
    const next = queue?.shift();
    if (!next) throw new Error(`unexpected request ${init.method ?? 'GET'} ${url}`);
    return next({ url, init });
  });
  vi.stubGlobal('fetch', fn);
  return calls;
}

const header = (call: Call, name: string) => (call.init.headers as Record<string, string>)[name];

beforeEach(() => queryClient.clear());
afterEach(() => vi.unstubAllGlobals());

describe('apiFetch', () => {
  it('GETs same-origin JSON without a CSRF token', async () => {
    const calls = fakeFetch({ '/api/v1/me': [() => json(200, { id: 7 })] });
    await expect(apiGet('/api/v1/me')).resolves.toEqual({ id: 7 });
    expect(calls).toHaveLength(1);
    expect(calls[0].init.credentials).toBe('same-origin');
    expect(calls[0].init.method).toBe('GET');
    expect(header(calls[0], 'x-csrf-token')).toBeUndefined();
  });

  it('turns the error shape into an ApiError with status, code, message and details', async () => {
    fakeFetch({
      '/api/v1/courses': [
        () => json(422, { error: { code: 'validation_failed', message: 'Code is required.', details: { field: 'code' } } }),
      ],
    });
    const error = await apiGet('/api/v1/courses').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({
      status: 422,
      code: 'validation_failed',
      message: 'Code is required.',
      details: { field: 'code' },
    });
  });

  it('reports a non-JSON failure as unexpected_response and a bare 401 as unauthenticated', async () => {
    fakeFetch({
      '/a': [() => new Response('<html>Bad gateway</html>', { status: 502, statusText: 'Bad Gateway' })],
      '/b': [() => new Response('', { status: 401 })],
    });
    await expect(apiGet('/a')).rejects.toMatchObject({ status: 502, code: 'unexpected_response' });
    await expect(apiGet('/b')).rejects.toMatchObject({ status: 401, code: 'unauthenticated' });
  });

  it('reports an unreachable server as network_error with status 0', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(apiGet('/api/v1/me')).rejects.toMatchObject({ status: 0, code: 'network_error' });
  });

  it('sends the CSRF token on POST, fetching it once and reusing it', async () => {
    const calls = fakeFetch({
      '/api/v1/csrf-token': [() => json(200, { token: 'tok-1' })],
      '/auth/logout': [() => json(200, { redirect: '/bye' }), () => json(200, { redirect: '/bye' })],
    });
    await expect(apiPost('/auth/logout')).resolves.toEqual({ redirect: '/bye' });
    await apiPost('/auth/logout');
    const posts = calls.filter((c) => c.init.method === 'POST');
    expect(posts.map((c) => header(c, 'x-csrf-token'))).toEqual(['tok-1', 'tok-1']);
    expect(calls.filter((c) => c.url === '/api/v1/csrf-token')).toHaveLength(1);
  });

  it('on 403 csrf_failed fetches a fresh token and retries once', async () => {
    const calls = fakeFetch({
      '/api/v1/csrf-token': [() => json(200, { token: 'stale' }), () => json(200, { token: 'fresh' })],
      '/api/v1/things': [
        () => json(403, { error: { code: 'csrf_failed', message: 'Bad token.' } }),
        () => json(201, { id: 1 }),
      ],
    });
    await expect(apiFetch('/api/v1/things', { method: 'PUT', body: { a: 1 } })).resolves.toEqual({ id: 1 });
    const puts = calls.filter((c) => c.init.method === 'PUT');
    expect(puts.map((c) => header(c, 'x-csrf-token'))).toEqual(['stale', 'fresh']);
    expect(puts[1].init.body).toBe('{"a":1}');
    expect(header(puts[1], 'content-type')).toBe('application/json');
  });

  it('retries a CSRF failure only once', async () => {
    const calls = fakeFetch({
      '/api/v1/csrf-token': [() => json(200, { token: 'a' }), () => json(200, { token: 'b' })],
      '/api/v1/things': [
        () => json(403, { error: { code: 'csrf_failed', message: 'Bad token.' } }),
        () => json(403, { error: { code: 'csrf_failed', message: 'Still bad.' } }),
      ],
    });
    await expect(apiFetch('/api/v1/things', { method: 'DELETE' })).rejects.toMatchObject({
      status: 403,
      code: 'csrf_failed',
      message: 'Still bad.',
    });
    expect(calls.filter((c) => c.init.method === 'DELETE')).toHaveLength(2);
  });

  it('does not retry a 403 that is not about the CSRF token', async () => {
    const calls = fakeFetch({
      '/api/v1/csrf-token': [() => json(200, { token: 'a' })],
      '/api/v1/things': [() => json(403, { error: { code: 'forbidden', message: 'Not yours.' } })],
    });
    await expect(apiFetch('/api/v1/things', { method: 'PATCH', body: {} })).rejects.toMatchObject({
      code: 'forbidden',
    });
    expect(calls.filter((c) => c.init.method === 'PATCH')).toHaveLength(1);
  });

  it('answers undefined for 204 No Content', async () => {
    fakeFetch({
      '/api/v1/csrf-token': [() => json(200, { token: 'a' })],
      '/api/v1/things/1': [() => new Response(null, { status: 204 })],
    });
    await expect(apiFetch('/api/v1/things/1', { method: 'DELETE' })).resolves.toBeUndefined();
  });
});

describe('withQuery', () => {
  it('appends defined parameters and skips null and undefined', () => {
    expect(withQuery('/api/v1/admin/audit', { limit: 50, before: null, x: undefined })).toBe(
      '/api/v1/admin/audit?limit=50',
    );
    expect(withQuery('/p?a=1', { before: 17 })).toBe('/p?a=1&before=17');
    expect(withQuery('/p', {})).toBe('/p');
  });
});
