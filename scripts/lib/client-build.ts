/** Builds the client with Vite when dist/client is missing or older than its sources. */
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const builtIndex = path.join(root, 'dist/client/index.html');

function newestMtime(dir: string): number {
  let newest = 0;
  for (const entry of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, entry.name);
    newest = Math.max(newest, entry.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return newest;
}

export function clientBuildIsStale(): boolean {
  if (!existsSync(builtIndex)) return true;
  const built = statSync(builtIndex).mtimeMs;
  return ['client', 'shared', 'fonts'].some((d) => newestMtime(path.join(root, d)) > built);
}

export async function ensureClientBuilt(log: (line: string) => void = console.log): Promise<void> {
  if (!clientBuildIsStale()) return;
  log('[client] building the client (vite build)…');
  const { build } = await import('vite');
  await build({ configFile: path.join(root, 'vite.config.ts'), logLevel: 'warn' });
}
