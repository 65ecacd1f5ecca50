/**
 * `npm start` (and `npm run dev` with --dev): everything a fresh machine needs
 * to run Bondmark locally with demo data.
 *  1. a private MariaDB in .data/mariadb (installed from Debian's packages if missing),
 *     unless DATABASE_URL points at a server;
 *  2. migrations, and the demo scenario when the database is empty;
 *  3. the local identity provider (unless OIDC_ISSUER is set) and SMTP catcher (unless SMTP_URL is set);
 *  4. the client build (production mode) or Vite's dev middleware (--dev);
 *  5. the app, at the printed address;
 *  6. the job worker (re-marking, similarity), stopped before the database on shutdown.
 */
import path from 'node:path';
import { readEnv, buildConfig } from '../server/src/platform/config';
import { createDb, migrateLatest } from '../server/src/platform/db';
import { createLogger } from '../server/src/platform/logging';
import { discoverOidc } from '../server/src/platform/auth/discovery';
import { createApp } from '../server/src/app';
import { startPrivateMariadb, stopStrayMariadb } from './lib/mariadb';
import { loadDevSecrets } from './lib/dev-secrets';
import { ensureClientBuilt } from './lib/client-build';

const dev = process.argv.includes('--dev');

async function main() {
  const env = readEnv();
  const cleanups: (() => Promise<void>)[] = [];
  const shutdown = async (code: number) => {
    for (const c of cleanups.reverse()) await c().catch((e) => console.error(e));
    process.exit(code);
  };
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));

  try {
    const isProduction = env.NODE_ENV === 'production';
    const dataDir = path.resolve(env.DATA_DIR);
    const secrets = isProduction ? null : loadDevSecrets(dataDir);

    // 1. database
    let databaseUrl = env.DATABASE_URL;
    if (!databaseUrl) {
      if (isProduction) throw new Error('DATABASE_URL must be set in production.');
      const mariadbDir = path.join(dataDir, 'mariadb');
      stopStrayMariadb(mariadbDir);
      const db = await startPrivateMariadb({ dataDir: mariadbDir, port: env.DB_PORT, database: 'bondmark' });
      cleanups.push(() => db.stop());
      databaseUrl = db.url;
    }
    const knex = createDb(databaseUrl);
    cleanups.push(() => knex.destroy());
    const [, applied] = await migrateLatest(knex);
    console.log(`[db] migrations: ${applied.length ? `applied ${applied.length}` : 'up to date'}`);

    // 2. identity provider
    const host = env.HOST;
    const publicUrl = (env.PUBLIC_URL ?? `http://${host}:${env.PORT}`).replace(/\/$/, '');
    let oidcIssuer = env.OIDC_ISSUER;
    let clientId = env.OIDC_CLIENT_ID;
    let clientSecret = env.OIDC_CLIENT_SECRET;
    let idpNote = '';
    if (!oidcIssuer) {
      const { startIdentityProvider } = await import('../server/src/dev/identity-provider');
      const { allDemoPeople, demoRoleAccounts } = await import('../seeds/demo-people');
      clientId = 'bondmark-local';
      clientSecret = secrets!.oidcClientSecret;
      const idp = await startIdentityProvider({
        port: env.DEV_IDP_PORT,
        host,
        accounts: allDemoPeople,
        featuredLogins: demoRoleAccounts.map((a) => a.login),
        clients: [{ clientId, clientSecret, redirectUris: [`${publicUrl}/auth/callback`], postLogoutRedirectUris: [`${publicUrl}/signin?signedOut=1`] }],
      });
      cleanups.push(() => idp.close());
      oidcIssuer = idp.issuer;
      idpNote = `local identity provider (stand-in) at ${idp.issuer}`;
    }

    // 3. demo data on an empty database
    const { count } = (await knex('users').count({ count: '*' }).first()) as { count: number };
    if (Number(count) === 0 && !isProduction) {
      const { seedDemo } = await import('../seeds/demo');
      await seedDemo(knex, oidcIssuer);
      console.log('[db] loaded the demo scenario (Aldermere University, Autumn 2026)');
    }

    // 4. mail
    let mailNote = '';
    if (!env.SMTP_URL && !isProduction) {
      const { startMailCatcher } = await import('../server/src/dev/mail-catcher');
      const mail = await startMailCatcher({ smtpPort: env.DEV_MAIL_SMTP_PORT, webPort: env.DEV_MAIL_WEB_PORT, host });
      cleanups.push(() => mail.close());
      process.env.SMTP_URL = `smtp://${host}:${mail.smtpPort}`;
      mailNote = `caught e-mail at ${mail.webUrl}`;
    }

    // 5. client
    if (!dev) await ensureClientBuilt();

    const config = buildConfig({
      ...env,
      OIDC_ISSUER: oidcIssuer,
      OIDC_CLIENT_ID: clientId,
      OIDC_CLIENT_SECRET: clientSecret,
      SESSION_SECRET: env.SESSION_SECRET ?? secrets?.sessionSecret,
      PUBLIC_URL: publicUrl,
    });
    const logger = createLogger(config.logLevel);
    const oidc = await discoverOidc(config.oidc.issuer);
    const built = await createApp({ db: knex, databaseUrl, config, oidc, logger, client: dev ? 'vite' : 'static' });
    cleanups.push(() => built.close());
    const server = built.app.listen(env.PORT, host);
    await new Promise<void>((resolve, reject) => {
      server.once('listening', () => resolve());
      server.once('error', reject);
    });
    cleanups.push(() => new Promise<void>((resolve) => server.close(() => resolve())));

    // 6. background jobs (re-marking, similarity) in this process; more servers may run workers too
    const { createJobWorker } = await import('../server/src/platform/jobs');
    const { reportJobHandlers } = await import('../server/src/modules/reports/jobs');
    const worker = createJobWorker({ db: knex, handlers: reportJobHandlers(), log: logger });
    worker.start();
    cleanups.push(() => worker.stop());

    console.log('');
    console.log(`Bondmark is running at ${publicUrl}  (${dev ? 'development, hot reload' : env.NODE_ENV})`);
    if (idpNote) console.log(`  sign-in: ${idpNote}; demo accounts: admin, lecturer, assistant, student`);
    if (mailNote) console.log(`  ${mailNote}`);
    console.log(`  stop with Ctrl+C (the data in ${env.DATABASE_URL ? 'your database' : path.relative(process.cwd(), dataDir) + '/'} is kept)`);
  } catch (err) {
    console.error(`\nBondmark could not start: ${(err as Error).message}`);
    await shutdown(1);
  }
}

void main();
