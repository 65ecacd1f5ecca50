/**
 * Signed-in clients for integration tests, one per login (made on first use),
 * with the CSRF token, and GET / multipart POST under /api/v1.
 */
import type { AppContext } from './app-context';
import type { CookieClient } from './cookie-client';

/** `context` is read when a client is first needed (the app starts in beforeAll). */
export function sessionClients(context: () => AppContext) {
  const clients = new Map<string, CookieClient>();
  async function as(login: string): Promise<{ client: CookieClient; token: string }> {
    const ctx = context();
    if (!clients.has(login)) clients.set(login, await ctx.signIn(login));
    const client = clients.get(login)!;
    return { client, token: await ctx.csrf(client) };
  }
  async function post<T>(login: string, path: string, form: FormData) {
    const { client, token } = await as(login);
    return client.json<T>(`${context().baseUrl}/api/v1${path}`, { method: 'POST', body: form, headers: { 'x-csrf-token': token } });
  }
  async function get<T>(login: string, path: string) {
    const { client } = await as(login);
    return client.json<T>(`${context().baseUrl}/api/v1${path}`);
  }
  return { as, post, get };
}
