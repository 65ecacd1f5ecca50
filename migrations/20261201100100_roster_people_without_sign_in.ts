import type { Knex } from 'knex';

/**
 * People known from a roster before they ever sign in: a users row with no
 * identity-provider subject yet. At their first sign-in the session module
 * attaches the issuer and subject to the row with the same e-mail.
 * (Several NULL pairs do not clash with the UNIQUE(oidc_issuer, oidc_subject) index.)
 */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('users', (t) => {
    t.string('oidc_issuer', 255).nullable().alter();
    t.string('oidc_subject', 255).nullable().alter();
  });
}

export async function down(knex: Knex): Promise<void> {
  const waiting = await knex('users').whereNull('oidc_subject').orWhereNull('oidc_issuer').count({ n: '*' }).first();
  if (Number(waiting?.n ?? 0) > 0) {
    throw new Error(`${waiting!.n} people from rosters have not signed in yet (users.oidc_subject is NULL); they would need an identity before this migration can be undone.`);
  }
  await knex.schema.alterTable('users', (t) => {
    t.string('oidc_issuer', 255).notNullable().alter();
    t.string('oidc_subject', 255).notNullable().alter();
  });
}
