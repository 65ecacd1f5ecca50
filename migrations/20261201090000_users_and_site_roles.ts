import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('users', (t) => {
    t.increments('id').primary();
    t.string('oidc_issuer', 255).notNullable();
    t.string('oidc_subject', 255).notNullable();
    t.string('email', 320).notNullable();
    t.string('display_name', 200).notNullable();
    t.boolean('active').notNullable().defaultTo(true);
    t.timestamp('last_sign_in_at').nullable();
    t.timestamp('created_at').notNullable().defaultTo(knex.fn.now());
    t.timestamp('updated_at').notNullable().defaultTo(knex.fn.now());
    t.unique(['oidc_issuer', 'oidc_subject']);
    t.index(['email']);
  });
  await knex.schema.createTable('user_site_roles', (t) => {
    t.integer('user_id').unsigned().notNullable().references('users.id').onDelete('CASCADE');
    t.enu('role', ['admin']).notNullable();
    t.timestamp('granted_at').notNullable().defaultTo(knex.fn.now());
    t.primary(['user_id', 'role']);
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('user_site_roles');
  await knex.schema.dropTable('users');
}
