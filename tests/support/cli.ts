/** The command line run as a child process, as a lecturer's script would run it. */
import { execFile } from 'node:child_process';
import { join } from 'node:path';

const ROOT = join(import.meta.dirname, '..', '..');
const TSX = join(ROOT, 'node_modules', '.bin', 'tsx');

export interface Run {
  code: number;
  stdout: string;
  stderr: string;
}

export function cli(args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(TSX, ['scripts/cli.ts', ...args], { cwd: ROOT, timeout: 60_000 }, (error, stdout, stderr) => {
      const code = error ? (typeof error.code === 'number' ? error.code : -1) : 0;
      resolve({ code, stdout, stderr });
    });
  });
}

/** Runs every case, four processes at a time, and returns the runs by case name. */
export async function runCases<K extends string>(cases: Record<K, string[]>): Promise<Record<K, Run>> {
  const results = {} as Record<K, Run>;
  const queue = Object.entries(cases) as Array<[K, string[]]>;
  const worker = async () => {
    for (let next = queue.shift(); next; next = queue.shift()) results[next[0]] = await cli(next[1]);
  };
  await Promise.all([worker(), worker(), worker(), worker()]);
  return results;
}
