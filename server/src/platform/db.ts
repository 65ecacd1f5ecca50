/**
 * Knex on MariaDB through mysql2. Migrations live in migrations/ (TypeScript,
 * loaded through tsx), seeds in seeds/.
 */
import knexFactory, { type Knex } from 'knex';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { readdirSync } from 'node:fs';
import path from 'node:path';

export const migrationsDirectory = fileURLToPath(new URL('../../../migrations', import.meta.url));

/**
 * Migrations are TypeScript files loaded with this module's own dynamic import,
 * so that they load the same way under tsx and under the test runner.
 */
class TypeScriptMigrationSource implements Knex.MigrationSource<string> {
  constructor(private readonly directory: string) {}
  async getMigrations() {
    return readdirSync(this.directory)
      .filter((f) => /^\d{14}_[\w-]+\.ts$/.test(f))
      .sort();
  }
  getMigrationName(file: string) {
    return file;
  }
  async getMigration(file: string): Promise<Knex.Migration> {
    return import(pathToFileURL(path.join(this.directory, file)).href);
  }
}

export function createDb(url: string, pool = { min: 0, max: 10 }): Knex {
  return knexFactory({
    client: 'mysql2',
    connection: {
      uri: url,
      timezone: 'Z',
      dateStrings: false,
      supportBigNumbers: true,
      charset: 'utf8mb4',
      // BOOLEAN columns come back as booleans; DECIMAL as numbers.
      typeCast(field: { type: string; length: number; string(): string | null }, next: () => unknown) {
        if (field.type === 'TINY' && field.length === 1) {
          const v = field.string();
          return v === null ? null : v === '1';
        }
        if (field.type === 'NEWDECIMAL') {
          const v = field.string();
          return v === null ? null : Number(v);
        }
        return next();
      },
    } as Knex.MySql2ConnectionConfig,
    pool,
    migrations: { migrationSource: new TypeScriptMigrationSource(migrationsDirectory), tableName: 'knex_migrations' },
  });
}

export const migrationConfig: Knex.MigratorConfig = {
  migrationSource: new TypeScriptMigrationSource(migrationsDirectory),
  tableName: 'knex_migrations',
};

export async function migrateLatest(db: Knex) {
  return db.migrate.latest(migrationConfig);
}

export async function databaseStatus(db: Knex): Promise<{ ok: boolean; latencyMs: number; error?: string }> {
  const started = performance.now();
  try {
    await db.raw('SELECT 1');
    return { ok: true, latencyMs: Math.round((performance.now() - started) * 10) / 10 };
  } catch (err) {
    return { ok: false, latencyMs: Math.round(performance.now() - started), error: (err as Error).message };
  }
}
