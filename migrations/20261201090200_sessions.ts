import type { Knex } from 'knex';

// The layout express-mysql-session expects (its schema.sql), created here so that
// the store never issues DDL itself.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(`CREATE TABLE sessions (
    session_id VARCHAR(128) COLLATE utf8mb4_bin NOT NULL,
    expires INT(11) UNSIGNED NOT NULL,
    data MEDIUMTEXT COLLATE utf8mb4_bin,
    PRIMARY KEY (session_id),
    KEY sessions_expires_index (expires)
  ) ENGINE=InnoDB`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions');
}
