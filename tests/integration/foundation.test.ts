import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startAppContext, type AppContext } from '../support/app-context';
import { CookieClient } from '../support/cookie-client';
import { seedPeople, seedTwoCourses } from '../support/seed-people';

let ctx: AppContext;

beforeAll(async () => {
  ctx = await startAppContext();
  // a course with a lecturer, an assistant and an enrolled student; 'lec2' teaches another course
  const k = ctx.db.knex;
  const people = await seedPeople(k, ctx.issuer, ['lec1', 'lec2', 'ta1', 'stu1']);
  const { c1 } = await seedTwoCourses(k, people);
  await k('enrolments').insert({ course_id: c1, user_id: people.stu1, student_number: '1000001' });
});

afterAll(async () => {
  await ctx?.close();
});

describe('health and error shape', () => {
  it('reports the database status', async () => {
    const r = await new CookieClient().json<{ status: string; database: { ok: boolean } }>(`${ctx.baseUrl}/api/health`);
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ status: 'ok', database: { ok: true } });
  });

  it('answers unknown API routes with 404 in the error shape', async () => {
    const r = await new CookieClient().json(`${ctx.baseUrl}/api/v1/no-such-thing`);
    expect(r.status).toBe(404);
    expect(r.body).toEqual({ error: { code: 'not_found', message: 'No API route GET /no-such-thing.' } });
  });

  it('answers a missing session with 401 in the error shape', async () => {
    const r = await new CookieClient().json(`${ctx.baseUrl}/api/v1/me`);
    expect(r.status).toBe(401);
    expect(r.body).toEqual({ error: { code: 'unauthenticated', message: expect.any(String) } });
    const post = await new CookieClient().json(`${ctx.baseUrl}/api/v1/courses`, { method: 'POST', body: '{}', headers: { 'content-type': 'application/json' } });
    expect(post.status).toBe(401);
  });

  it('answers bad JSON from a signed-in caller with 400 and says why', async () => {
    const client = await ctx.signIn('lec1');
    const token = await ctx.csrf(client);
    const r = await client.json<{ error: { code: string; message: string } }>(`${ctx.baseUrl}/api/v1/courses`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-csrf-token': token },
      body: '{"title": ',
    });
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('bad_request');
    expect(r.body.error.message).toMatch(/not valid JSON/);
  });

  it('refuses a state change without the CSRF token', async () => {
    const client = await ctx.signIn('lec1');
    const r = await client.json<{ error: { code: string } }>(`${ctx.baseUrl}/auth/logout`, { method: 'POST' });
    expect(r.status).toBe(403);
    expect(r.body.error.code).toBe('csrf_failed');
    // still signed in
    expect((await client.json(`${ctx.baseUrl}/api/v1/me`)).status).toBe(200);
  });

  it('validates query strings and names the field', async () => {
    const admin = await ctx.signIn('adm');
    const r = await admin.json<{ error: { code: string; message: string; details: { location: string; path: string }[] } }>(`${ctx.baseUrl}/api/v1/admin/audit?limit=abc`);
    expect(r.status).toBe(400);
    expect(r.body.error.code).toBe('validation_failed');
    expect(r.body.error.details[0]).toMatchObject({ location: 'query', path: 'limit' });
  });
});

describe('sign-in through the identity provider', () => {
  it('goes login → provider → callback → returnTo over real redirects and creates the user on first sign-in', async () => {
    const before = await ctx.db.knex('users').where({ oidc_subject: 'stu2' }).first();
    expect(before).toBeUndefined();
    const client = await ctx.signIn('stu2', '/courses');
    const me = await client.json<{ displayName: string; roles: string[]; email: string }>(`${ctx.baseUrl}/api/v1/me`);
    expect(me.status).toBe(200);
    expect(me.body).toMatchObject({ displayName: 'Sam Student', email: 'stu2@test.example', roles: [] });
    const row = await ctx.db.knex('users').where({ oidc_subject: 'stu2', oidc_issuer: ctx.issuer }).first();
    expect(row).toBeDefined();
    const audit = await ctx.db.knex('audit_log').where({ actor_id: row.id, action: 'user.created_on_first_sign_in' });
    expect(audit).toHaveLength(1);
  });

  it.each([
    ['adm', ['admin']],
    ['lec1', ['lecturer']],
    ['ta1', ['assistant']],
    ['stu1', ['student']],
  ])('%s signs in and gets roles %j', async (login, roles) => {
    const client = await ctx.signIn(login);
    const me = await client.json<{ roles: string[]; isAdmin: boolean }>(`${ctx.baseUrl}/api/v1/me`);
    expect(me.body.roles).toEqual(roles);
    expect(me.body.isAdmin).toBe(login === 'adm');
  });

  it('makes the people named in ADMIN_EMAILS admins', async () => {
    const client = await ctx.signIn('adm');
    const me = await client.json<{ id: number }>(`${ctx.baseUrl}/api/v1/me`);
    const roles = await ctx.db.knex('user_site_roles').where({ user_id: me.body.id });
    expect(roles.map((r) => r.role)).toEqual(['admin']);
  });

  it('refuses a returnTo that leaves the site', async () => {
    const client = new CookieClient();
    const hops = await client.follow(`${ctx.baseUrl}/auth/login?returnTo=${encodeURIComponent('//evil.example/x')}`);
    const page = hops[hops.length - 1];
    const action = /action="(\/interaction\/[^"]+\/login)"/.exec(page.body)![1];
    const after = await client.follow(new URL(action, ctx.issuer).toString(), {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: 'login=stu1',
    });
    const redirects = after.map((h) => h.headers.get('location')).filter(Boolean);
    expect(redirects).not.toContain('//evil.example/x');
    expect(after.some((h) => h.url === `${ctx.baseUrl}/`)).toBe(true);
  });

  it('stores sessions in MariaDB', async () => {
    await ctx.signIn('ta1');
    const [{ n }] = await ctx.db.knex('sessions').count({ n: '*' });
    expect(Number(n)).toBeGreaterThan(0);
  });

  it('signs out at both ends: the session ends here and the provider is told', async () => {
    const client = await ctx.signIn('lec1');
    const token = await ctx.csrf(client);
    const out = await client.json<{ redirect: string }>(`${ctx.baseUrl}/auth/logout`, { method: 'POST', headers: { 'x-csrf-token': token } });
    expect(out.status).toBe(200);
    const redirect = new URL(out.body.redirect);
    expect(redirect.origin).toBe(ctx.issuer);
    expect(redirect.searchParams.get('id_token_hint')).toBeTruthy();
    expect((await client.json(`${ctx.baseUrl}/api/v1/me`)).status).toBe(401);
    // the provider's end-session page ends its own session (auto-submitted form) and returns to us
    const page = await client.request(out.body.redirect);
    expect(page.status).toBe(200);
    const action = /action="([^"]+)"/.exec(page.body)![1];
    const xsrf = /name="xsrf" value="([^"]+)"/.exec(page.body)![1];
    const hops = await client.follow(new URL(action, ctx.issuer).toString(), {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ xsrf, logout: 'yes' }).toString(),
    });
    expect(hops.some((h) => h.url.startsWith(`${ctx.baseUrl}/signin?signedOut=1`))).toBe(true);
    // a new sign-in must show the provider's login form again (no provider session left)
    const again = await client.follow(`${ctx.baseUrl}/auth/login?returnTo=/`);
    expect(again[again.length - 1].body).toContain('University login');
  });
});

describe('role and scope', () => {
  it('admin routes: 401 without a session, 403 for a lecturer, 200 for an admin', async () => {
    expect((await new CookieClient().json(`${ctx.baseUrl}/api/v1/admin/users`)).status).toBe(401);
    const lec = await ctx.signIn('lec1');
    const denied = await lec.json<{ error: { code: string } }>(`${ctx.baseUrl}/api/v1/admin/users`);
    expect(denied.status).toBe(403);
    expect(denied.body.error.code).toBe('forbidden');
    const adm = await ctx.signIn('adm');
    const ok = await adm.json<{ users: { displayName: string }[] }>(`${ctx.baseUrl}/api/v1/admin/users`);
    expect(ok.status).toBe(200);
    expect(ok.body.users.map((u) => u.displayName)).toContain('Lena Lecturer');
  });

  it('courses are scoped: each person sees only their own, admins see all', async () => {
    const codes = async (login: string) => {
      const c = await ctx.signIn(login);
      const r = await c.json<{ courses: { code: string; myRole: string | null }[] }>(`${ctx.baseUrl}/api/v1/courses`);
      return r.body.courses.map((x) => `${x.code}:${x.myRole}`);
    };
    expect(await codes('lec1')).toEqual(['TST 101:lecturer']);
    expect(await codes('lec2')).toEqual(['TST 202:lecturer']);
    expect(await codes('ta1')).toEqual(['TST 101:assistant']);
    expect(await codes('stu1')).toEqual(['TST 101:student']);
    expect(await codes('nobody')).toEqual([]);
    expect((await codes('adm')).sort()).toEqual(['TST 101:null', 'TST 202:null']);
  });

  it('the audit log is append-only at the database', async () => {
    await ctx.db.knex('audit_log').insert({ action: 'test.entry', entity_type: 'test' });
    await expect(ctx.db.knex('audit_log').update({ action: 'tampered' })).rejects.toThrow(/append-only/);
    await expect(ctx.db.knex('audit_log').delete()).rejects.toThrow(/append-only/);
  });
});
