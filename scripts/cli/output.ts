/** JSON output of the commands: two-space indented, numbers in full double precision. */
import type { CliOutput } from './command';

export function writeJson(out: CliOutput, value: unknown): void {
  out.write(`${JSON.stringify(value, null, 2)}\n`);
}
