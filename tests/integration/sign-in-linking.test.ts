import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startAppContext, type AppContext } from '../support/app-context';

let ctx: AppContext;
let rosterUserId: number;

beforeAll(async () => {
  ctx = await startAppContext({ adminEmails: ['adm@test.example', 'adm2@test.example'] });
  // a person known only from a roster: no identity yet
  [rosterUserId] = await ctx.db.knex('users').insert({ oidc_issuer: null, oidc_subject: null, email: 'roster.only@test.example', display_name: 'Rosa Rostered' });
});
afterAll(async () => {
  await ctx?.close();
});

describe('first sign-in of people known from a roster', () => {
  it('an unverified address is not joined to the roster entry and gets no admin role', async () => {
    const client = await ctx.signIn('unverified');
    const me = await client.json<{ id: number; isAdmin: boolean }>(`${ctx.baseUrl}/api/v1/me`);
    expect(me.body.id).not.toBe(rosterUserId);
    const rosterRow = await ctx.db.knex('users').where({ id: rosterUserId }).first();
    expect(rosterRow.oidc_subject).toBeNull();

    const claimant = await ctx.signIn('unverified-admin');
    const claimantMe = await claimant.json<{ isAdmin: boolean }>(`${ctx.baseUrl}/api/v1/me`);
    expect(claimantMe.body.isAdmin).toBe(false);
  });

  it('a verified address is joined to the roster entry', async () => {
    const client = await ctx.signIn('roster-only');
    const me = await client.json<{ id: number }>(`${ctx.baseUrl}/api/v1/me`);
    expect(me.body.id).toBe(rosterUserId);
    const row = await ctx.db.knex('users').where({ id: rosterUserId }).first();
    expect(row.oidc_subject).toBe('roster-only');
    expect(await ctx.db.knex('audit_log').where({ action: 'user.linked_on_first_sign_in', entity_id: String(rosterUserId) })).toHaveLength(1);
  });
});
