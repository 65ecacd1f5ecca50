/**
 * `npm run db:start|db:migrate|db:rollback|db:seed`: the database chores, on
 * DATABASE_URL or on the private MariaDB in DATA_DIR (started for the chore
 * and stopped after, except for db:start which keeps it running).
 */
import path from 'node:path';
import { readEnv } from '../server/src/platform/config';
import { createDb, migrateLatest, migrationConfig } from '../server/src/platform/db';
import { startPrivateMariadb, stopStrayMariadb } from './lib/mariadb';

const command = process.argv[2];
const commands = ['start', 'migrate', 'rollback', 'seed'];

async function main() {
  if (!commands.includes(command)) {
    console.error(`usage: tsx scripts/db.ts ${commands.join('|')}`);
    process.exit(2);
  }
  const env = readEnv();
  let url = env.DATABASE_URL;
  let stop = async () => {};
  if (!url) {
    const dir = path.join(path.resolve(env.DATA_DIR), 'mariadb');
    stopStrayMariadb(dir);
    const db = await startPrivateMariadb({ dataDir: dir, port: env.DB_PORT, database: 'bondmark' });
    url = db.url;
    stop = () => db.stop();
  }
  if (command === 'start') {
    console.log(`MariaDB is running: DATABASE_URL=${url.replace(/:[^:@/]+@/, ':***@')}  (Ctrl+C stops it)`);
    process.on('SIGINT', () => void stop().then(() => process.exit(0)));
    process.on('SIGTERM', () => void stop().then(() => process.exit(0)));
    return;
  }
  const knex = createDb(url);
  try {
    if (command === 'migrate') {
      const [, applied] = await migrateLatest(knex);
      console.log(applied.length ? `applied: ${applied.join(', ')}` : 'already up to date');
    } else if (command === 'rollback') {
      const [, undone] = await knex.migrate.rollback(migrationConfig);
      console.log(undone.length ? `rolled back: ${undone.join(', ')}` : 'nothing to roll back');
    } else if (command === 'seed') {
      await migrateLatest(knex);
      const { count } = (await knex('users').count({ count: '*' }).first()) as { count: number };
      if (Number(count) > 0) {
        console.error('The database already has people in it; the demo scenario loads only into an empty database.');
        process.exitCode = 2;
      } else {
        const { seedDemo } = await import('../seeds/demo');
        await seedDemo(knex, env.OIDC_ISSUER ?? `http://${env.HOST}:${env.DEV_IDP_PORT}`);
        console.log('loaded the demo scenario');
      }
    }
  } finally {
    await knex.destroy();
    await stop();
  }
}

main().catch((err) => {
  console.error(err.message);
  process.exit(1);
});
