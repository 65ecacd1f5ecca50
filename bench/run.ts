/**
 * Benchmark runner: `npm run bench -- <name> [args]` runs bench/<name>.ts.
 * A benchmark file's default export is `(args: string[]) => BenchOutcome | void`
 * (sync or async); it prints its own table. The exit status is 1 when it reports
 * `passed: false` (a target missed), 2 for an unknown name, else 0.
 * Helpers shared by benchmarks live in bench/lib/ (not runnable by name).
 */
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export interface BenchOutcome {
  passed: boolean;
}

const here = dirname(fileURLToPath(import.meta.url));
const available = readdirSync(here)
  .filter((file) => file.endsWith('.ts') && file !== 'run.ts')
  .map((file) => file.slice(0, -'.ts'.length))
  .sort();

const [name, ...args] = process.argv.slice(2);
if (name === undefined || !available.includes(name)) {
  const what = name === undefined ? 'no benchmark named' : `unknown benchmark '${name}'`;
  process.stderr.write(`error: ${what}; available: ${available.join(', ')} (npm run bench -- <name>)\n`);
  process.exit(2);
}

const module = (await import(pathToFileURL(join(here, `${name}.ts`)).href)) as {
  default?: (args: string[]) => BenchOutcome | void | Promise<BenchOutcome | void>;
};
if (typeof module.default !== 'function') {
  process.stderr.write(`error: bench/${name}.ts has no default export to run\n`);
  process.exit(2);
}
const outcome = await module.default(args);
if (outcome && outcome.passed === false) process.exitCode = 1;
