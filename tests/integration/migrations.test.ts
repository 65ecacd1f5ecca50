import { afterAll, describe, expect, it } from 'vitest';
import { createTestDatabase, type TestDatabase } from '../support/database';
import { migrationConfig } from '@server/platform/db';

let db: TestDatabase;
afterAll(async () => {
  await db?.drop();
});

async function tables(): Promise<string[]> {
  const [rows] = await db.knex.raw('SHOW TABLES');
  return (rows as Record<string, string>[]).map((r) => Object.values(r)[0]).filter((t) => !t.startsWith('knex_')).sort();
}

describe('migrations', () => {
  it('go up, all the way down, and up again', async () => {
    db = await createTestDatabase({ migrate: false });
    const [, up] = await db.knex.migrate.latest(migrationConfig);
    expect(up.length).toBeGreaterThanOrEqual(4);
    expect(await tables()).toEqual(expect.arrayContaining(['audit_log', 'course_staff', 'courses', 'enrolments', 'sessions', 'terms', 'user_site_roles', 'users', 'sections', 'exercises', 'exercise_revisions', 'variants', 'reports', 'marks', 'adjustments', 'jobs', 'stored_files', 'similarity_flags']));
    await db.knex.migrate.rollback(migrationConfig, true);
    expect(await tables()).toEqual([]);
    const [, again] = await db.knex.migrate.latest(migrationConfig);
    expect(again).toEqual(up);
    const [, none] = await db.knex.migrate.latest(migrationConfig);
    expect(none).toEqual([]);
  });
});
