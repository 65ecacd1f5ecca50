/**
 * One private MariaDB for the whole test run, in a temporary directory on a
 * free loopback port; each test file makes its own database in it
 * (see context.ts). When DATABASE_URL is set, that server is used instead.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import net from 'node:net';
import type { TestProject } from 'vitest/node';
import { startPrivateMariadb } from '../../scripts/lib/mariadb';

declare module 'vitest' {
  export interface ProvidedContext {
    /** mysql:// URL of a server where tests may create databases; its path names a scratch database */
    mariadbUrl: string;
  }
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const port = (s.address() as net.AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

export default async function setup(project: TestProject) {
  if (process.env.DATABASE_URL) {
    project.provide('mariadbUrl', process.env.DATABASE_URL);
    return;
  }
  const dir = mkdtempSync(path.join(tmpdir(), 'bondmark-test-db-'));
  const db = await startPrivateMariadb({ dataDir: dir, port: await freePort(), database: 'bondmark_scratch', log: () => {} });
  project.provide('mariadbUrl', db.url);
  return async () => {
    await db.stop();
    rmSync(dir, { recursive: true, force: true });
  };
}
