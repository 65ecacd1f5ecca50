/** Command-line pieces in process: distance grids, flag checks and the dispatcher's exit codes. */
import { describe, expect, it } from 'vitest';
import { parseDistance, parseDistanceRange } from '../../scripts/cli/distance-range';
import { runCli } from '../../scripts/cli/run';
import { commands } from '../../scripts/cli/commands';

async function run(args: string[]) {
  let stdout = '';
  let stderr = '';
  const code = await runCli(args, { stdout: { write: (t) => void (stdout += t) }, stderr: { write: (t) => void (stderr += t) } });
  return { code, stdout, stderr };
}

describe('distance grids start:end:step', () => {
  it('includes the end, computes start + k·step and keeps the typed decimals', () => {
    const grid = parseDistanceRange('0.5:10:0.05');
    expect(grid).toHaveLength(191);
    expect(grid[3]).toBe(0.65); // 0.5 + 3·0.05 = 0.6500000000000001 before rounding
    expect(grid[190]).toBe(10);
    expect(parseDistanceRange('0.1:0.3:0.1')).toEqual([0.1, 0.2, 0.3]);
    expect(parseDistanceRange('1:2:0.3')).toEqual([1, 1.3, 1.6, 1.9]); // 2 is not on the grid
    expect(parseDistanceRange('2:2:1')).toEqual([2]);
  });
  it('rejects impossible grids with one sentence', () => {
    expect(() => parseDistanceRange('0:1:0.1')).toThrow(/greater than 0 bohr/);
    expect(() => parseDistanceRange('1:2:0')).toThrow(/step must be greater than 0/);
    expect(() => parseDistanceRange('2:1:0.1')).toThrow(/lies below start/);
    expect(() => parseDistanceRange('1:2')).toThrow(/start:end:step/);
    expect(() => parseDistanceRange('1:1e9:1e-3')).toThrow(/at most 100000/);
    expect(() => parseDistance('abc')).toThrow(/one distance in bohr/);
  });
});

describe('dispatcher', () => {
  it('has one entry per command, each loading the command of that name', async () => {
    expect(commands.map((c) => c.name)).toEqual(['curve', 'minimum', 'point', 'diagram', 'huckel', 'mark']);
    for (const entry of commands) expect((await entry.load()).name).toBe(entry.name);
  });
  it('passes a negative number through to the validation (--r -1), and exits 2', async () => {
    const r = await run(['curve', '--model', 'exact', '--r', '-1:2:0.5']);
    expect(r.code).toBe(2);
    expect(r.stderr).toBe('error: --r: distances must be greater than 0 bohr, got start -1\n');
  });
  it('reports a flag without a value, a bad choice and a bad number', async () => {
    expect((await run(['point', '--model', 'lcao', '--r'])).stderr).toBe('error: --r needs a value\n');
    expect((await run(['point', '--model', 'lcao', '--state', 'up', '--r', '2'])).stderr).toMatch(/^error: --state must be one of bonding, antibonding, got 'up'\n$/);
    expect((await run(['point', '--model', 'lcao', '--za', 'two', '--r', '2'])).stderr).toBe("error: --za must be a number, got 'two'\n");
    expect((await run(['huckel', '--ring', '2'])).stderr).toMatch(/^error: a ring needs a whole number of atoms ≥ 3/);
  });
  it('point with the exact model and --za ≠ --zb gives the lowest state; σu is refused', async () => {
    const ok = await run(['point', '--model', 'exact', '--za', '1', '--zb', '2', '--r', '2']);
    expect(ok.code).toBe(0);
    expect(JSON.parse(ok.stdout).zeta).toBeNull();
    const bad = await run(['point', '--model', 'exact', '--za', '1', '--zb', '2', '--state', 'antibonding', '--r', '2']);
    expect(bad.code).toBe(2);
    expect(bad.stderr).toMatch(/only the lowest state/);
  });
  it('--help lists every command with its summary', async () => {
    const r = await run(['--help']);
    expect(r.code).toBe(0);
    for (const name of ['curve', 'minimum', 'point', 'diagram', 'huckel']) expect(r.stdout).toMatch(new RegExp(`\\n  ${name} +\\S`));
  });
  it('command help goes to stdout with status 0', async () => {
    const r = await run(['diagram', '--help']);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^usage: npm run --silent cli -- diagram --formula/);
  });
});
