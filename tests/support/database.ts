/** A fresh, migrated database per test file, in the run's private MariaDB. */
import { inject } from 'vitest';
import { randomBytes } from 'node:crypto';
import mysql from 'mysql2/promise';
import type { Knex } from 'knex';
import { createDb, migrateLatest } from '@server/platform/db';

export interface TestDatabase {
  url: string;
  name: string;
  knex: Knex;
  drop(): Promise<void>;
}

export async function createTestDatabase(options: { migrate?: boolean } = {}): Promise<TestDatabase> {
  const base = new URL(inject('mariadbUrl'));
  const name = `bm_t_${randomBytes(5).toString('hex')}`;
  const admin = await mysql.createConnection({ host: base.hostname, port: Number(base.port), user: decodeURIComponent(base.username), password: decodeURIComponent(base.password) });
  await admin.query(`CREATE DATABASE \`${name}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await admin.end();
  const url = new URL(base);
  url.pathname = `/${name}`;
  const knex = createDb(url.toString());
  if (options.migrate !== false) await migrateLatest(knex);
  return {
    url: url.toString(),
    name,
    knex,
    async drop() {
      await knex.destroy();
      const c = await mysql.createConnection({ host: base.hostname, port: Number(base.port), user: decodeURIComponent(base.username), password: decodeURIComponent(base.password) });
      await c.query(`DROP DATABASE IF EXISTS \`${name}\``);
      await c.end();
    },
  };
}
