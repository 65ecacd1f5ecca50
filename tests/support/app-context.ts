/**
 * A running Bondmark for one test file: its own database, the stand-in
 * identity provider and the app on free loopback ports, over real HTTP.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import pino from 'pino';
import { createApp } from '@server/app';
import { buildConfig, readEnv } from '@server/platform/config';
import { discoverOidc } from '@server/platform/auth/discovery';
import { startIdentityProvider, type StandInAccount } from '@server/dev/identity-provider';
import { createTestDatabase, type TestDatabase } from './database';
import { CookieClient } from './cookie-client';

export const testAccounts: StandInAccount[] = [
  { login: 'adm', email: 'adm@test.example', givenName: 'Ada', familyName: 'Admin' },
  { login: 'lec1', email: 'lec1@test.example', givenName: 'Lena', familyName: 'Lecturer' },
  { login: 'lec2', email: 'lec2@test.example', givenName: 'Leo', familyName: 'Otherlecturer' },
  { login: 'ta1', email: 'ta1@test.example', givenName: 'Tariq', familyName: 'Assistant' },
  { login: 'stu1', email: 'stu1@test.example', givenName: 'Stella', familyName: 'Student' },
  { login: 'stu2', email: 'stu2@test.example', givenName: 'Sam', familyName: 'Student' },
  { login: 'nobody', email: 'nobody@test.example', givenName: 'Noor', familyName: 'Norole' },
  // an account whose address the provider has not verified (it claims a roster student's and an admin's address)
  { login: 'unverified', email: 'roster.only@test.example', givenName: 'Una', familyName: 'Verified', emailVerified: false },
  { login: 'unverified-admin', email: 'adm2@test.example', givenName: 'Ulla', familyName: 'Claimant', emailVerified: false },
  { login: 'roster-only', email: 'roster.only@test.example', givenName: 'Rosa', familyName: 'Rostered' },
];

export interface AppContext {
  baseUrl: string;
  issuer: string;
  db: TestDatabase;
  /** signs in through the identity provider over real redirects; returns the client holding the session */
  signIn(login: string, returnTo?: string): Promise<CookieClient>;
  /** a CSRF token for a signed-in client */
  csrf(client: CookieClient): Promise<string>;
  close(): Promise<void>;
}

export async function startAppContext(options: { client?: 'none' | 'static'; adminEmails?: string[]; signinRateLimitPerMinute?: number } = {}): Promise<AppContext> {
  const db = await createTestDatabase();
  const server = http.createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', () => resolve()));
  const port = (server.address() as AddressInfo).port;
  const baseUrl = `http://127.0.0.1:${port}`;

  const clientSecret = 'test-client-secret-not-for-production';
  const idp = await startIdentityProvider({
    port: 0,
    accounts: testAccounts,
    clients: [{ clientId: 'bondmark-test', clientSecret, redirectUris: [`${baseUrl}/auth/callback`], postLogoutRedirectUris: [`${baseUrl}/signin?signedOut=1`] }],
  });

  const env = readEnv({
    NODE_ENV: 'test',
    PUBLIC_URL: baseUrl,
    SESSION_SECRET: 'test-session-secret-0123456789abcdef0123456789',
    OIDC_ISSUER: idp.issuer,
    OIDC_CLIENT_ID: 'bondmark-test',
    OIDC_CLIENT_SECRET: clientSecret,
    ADMIN_EMAILS: (options.adminEmails ?? ['adm@test.example']).join(','),
    SIGNIN_RATE_LIMIT_PER_MINUTE: String(options.signinRateLimitPerMinute ?? 1000),
    LOG_LEVEL: 'silent',
  });
  const config = buildConfig(env);
  const oidc = await discoverOidc(idp.issuer);
  const built = await createApp({ db: db.knex, databaseUrl: db.url, config, oidc, logger: pino({ level: 'silent' }), client: options.client ?? 'none' });
  server.on('request', built.app);

  async function signIn(login: string, returnTo = '/'): Promise<CookieClient> {
    const client = new CookieClient();
    const toLogin = await client.follow(`${baseUrl}/auth/login?returnTo=${encodeURIComponent(returnTo)}`);
    const page = toLogin[toLogin.length - 1];
    const action = /action="(\/interaction\/[^"]+\/login)"/.exec(page.body)?.[1];
    if (!action) throw new Error(`no sign-in form at ${page.url} (status ${page.status})`);
    const hops = await client.follow(new URL(action, idp.issuer).toString(), {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ login }).toString(),
    });
    const landed = hops.find((h) => h.url === `${baseUrl}${returnTo}`);
    if (!landed) throw new Error(`sign-in as ${login} did not land on ${returnTo}: ${hops.map((h) => `${h.status} ${h.url}`).join(' → ')}`);
    return client;
  }

  return {
    baseUrl,
    issuer: idp.issuer,
    db,
    signIn,
    async csrf(client) {
      const r = await client.json<{ token: string }>(`${baseUrl}/api/v1/csrf-token`);
      return r.body.token;
    },
    async close() {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      await built.close();
      await idp.close();
      await db.drop();
    },
  };
}
