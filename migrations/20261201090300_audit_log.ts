import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_log', (t) => {
    t.bigIncrements('id').primary();
    t.timestamp('at', { precision: 3 }).notNullable().defaultTo(knex.raw('CURRENT_TIMESTAMP(3)'));
    t.integer('actor_id').unsigned().nullable().references('users.id');
    t.string('action', 64).notNullable();
    t.string('entity_type', 64).notNullable();
    t.string('entity_id', 64).nullable();
    t.json('before_json').nullable();
    t.json('after_json').nullable();
    t.index(['entity_type', 'entity_id']);
    t.index(['actor_id']);
  });
  // Append-only: the database itself refuses to change or remove an entry.
  await knex.raw(`CREATE TRIGGER audit_log_no_update BEFORE UPDATE ON audit_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only'`);
  await knex.raw(`CREATE TRIGGER audit_log_no_delete BEFORE DELETE ON audit_log FOR EACH ROW
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'audit_log is append-only'`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP TRIGGER IF EXISTS audit_log_no_update');
  await knex.raw('DROP TRIGGER IF EXISTS audit_log_no_delete');
  await knex.schema.dropTable('audit_log');
}
