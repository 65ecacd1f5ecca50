/**
 * The engine's command line run as a child process (as a lecturer's script would run it):
 * output shape of each command and the bad-input errors (status 2, one line on stderr).
 * All processes start together in beforeAll (four at a time) to keep the file quick.
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { curvePoint } from '@shared/chemistry/curves';
import { runCases, type Run } from '../support/cli';


const dir = mkdtempSync(join(tmpdir(), 'bondmark-cli-'));
const allylCation = join(dir, 'allyl-cation.json');
writeFileSync(allylCation, JSON.stringify({ name: 'allyl cation', atoms: ['C', 'C', 'C'], bonds: [[0, 1], [1, 2]], charge: 1 }));
const brokenGraph = join(dir, 'broken.json');
writeFileSync(brokenGraph, '{"atoms": ["C", "C"], "bonds": [[0, 7]]}');

const cases = {
  curveFixed: ['curve', '--model', 'lcao', '--r', '0.5:10:0.05'],
  curveOptimized: ['curve', '--model', 'h2-vb', '--zeta', 'opt', '--r', '1:2:0.25'],
  minimum: ['minimum', '--model', 'lcao', '--zeta', 'opt'],
  minimumRepulsive: ['minimum', '--model', 'h2-mo', '--state', 'antibonding'],
  point: ['point', '--model', 'exact', '--r', '2.0'],
  diagram: ['diagram', '--formula', 'O2', '--charge', '1'],
  huckelChain: ['huckel', '--chain', '4'],
  huckelGraph: ['huckel', '--graph', allylCation],
  negativeDistance: ['point', '--model', 'lcao', '--r', '-1'],
  unknownFormula: ['diagram', '--formula', 'Xy2'],
  unknownFlag: ['curve', '--model', 'lcao', '--r', '1:2:0.5', '--colour', 'red'],
  missingModel: ['minimum', '--zeta', 'opt'],
  h2Charges: ['curve', '--model', 'h2-ci', '--za', '1', '--zb', '2', '--r', '1:2:0.5'],
  electronsDoNotFit: ['diagram', '--formula', 'He2', '--charge', '-1'],
  badGraph: ['huckel', '--graph', brokenGraph],
} satisfies Record<string, string[]>;

let results = {} as Record<keyof typeof cases, Run>;

beforeAll(async () => {
  results = await runCases(cases);
}, 300_000);

const json = (run: Run) => JSON.parse(run.stdout) as Record<string, unknown>;

describe('cli curve', () => {
  it('prints r_bohr,energy_hartree for start:end:step, end included, decimals as typed, full precision', () => {
    const run = results.curveFixed;
    expect(run.code).toBe(0);
    expect(run.stderr).toBe('');
    const lines = run.stdout.trimEnd().split('\n');
    expect(lines[0]).toBe('r_bohr,energy_hartree');
    expect(lines).toHaveLength(1 + 191); // 0.5, 0.55, …, 10
    expect(lines[1].split(',')[0]).toBe('0.5');
    expect(lines[4].split(',')[0]).toBe('0.65');
    expect(lines.at(-1)!.split(',')[0]).toBe('10');
    const [r, e] = lines[31].split(',').map(Number); // R = 2
    expect(r).toBe(2);
    expect(e).toBe(curvePoint({ model: 'lcao', za: 1, zb: 1, zeta: 1, state: 'bonding' }, 2).energyHartree); // printed round-trip exact
    expect(e).toBeCloseTo(-0.553771, 6); // science.md §1, E+ at R = 2 a0, ζ = 1 (computed)
  });

  it('adds a zeta column when ζ is optimized', () => {
    const run = results.curveOptimized;
    expect(run.code).toBe(0);
    const lines = run.stdout.trimEnd().split('\n');
    expect(lines[0]).toBe('r_bohr,energy_hartree,zeta');
    expect(lines.slice(1).map((l) => l.split(',')[0])).toEqual(['1', '1.25', '1.5', '1.75', '2']);
    const [, energy, zeta] = lines[3].split(',').map(Number); // R = 1.5
    const ref = curvePoint({ model: 'h2-vb', za: 1, zb: 1, zeta: 'opt', state: 'bonding' }, 1.5);
    expect(energy).toBeCloseTo(ref.energyHartree, 12);
    expect(zeta).toBeCloseTo(ref.zeta!, 6);
  });
});

describe('cli minimum and point', () => {
  it('minimum prints re_bohr, energy_hartree, de_ev, zeta', () => {
    const run = results.minimum;
    expect(run.code).toBe(0);
    const out = json(run);
    expect(Object.keys(out)).toEqual(expect.arrayContaining(['re_bohr', 'energy_hartree', 'de_ev', 'zeta']));
    expect(out.re_bohr as number).toBeCloseTo(2.003, 3); // science.md §1: Finkelstein & Horowitz 1928 (from memory); computed
    expect(out.energy_hartree as number).toBeCloseTo(-0.58651, 5); // science.md §1 (from memory); computed
    expect(out.de_ev as number).toBeCloseTo(2.354, 3); // science.md §1 (from memory); computed
    expect(out.zeta as number).toBeCloseTo(1.238, 3); // science.md §1 (from memory)
  });

  it('minimum of a repulsive curve says so with nulls', () => {
    const run = results.minimumRepulsive;
    expect(run.code).toBe(0);
    expect(json(run)).toMatchObject({ re_bohr: null, energy_hartree: null, de_ev: null, zeta: null, bound: false });
  });

  it('point prints energy_hartree and electronic_hartree', () => {
    const run = results.point;
    expect(run.code).toBe(0);
    const out = json(run);
    expect(Math.abs((out.electronic_hartree as number) - -1.1026342144949)).toBeLessThan(1e-9); // science.md §2: Bates et al. 1953 (from memory)
    expect(out.energy_hartree as number).toBeCloseTo((out.electronic_hartree as number) + 0.5, 14); // + 1/R
  });
});

describe('cli diagram and huckel', () => {
  it('diagram prints levels, bondOrder, unpairedElectrons, magnetism and a structured termSymbol', () => {
    const run = results.diagram;
    expect(run.code).toBe(0);
    const out = json(run);
    expect(out.bondOrder).toBe(2.5); // O2+ bond order, science.md §4
    expect(out.unpairedElectrons).toBe(1);
    expect(out.magnetism).toBe('paramagnetic');
    expect(out.termSymbol).toEqual({ multiplicity: 2, lambda: 'Pi', parity: 'g', reflection: null, text: '²Πg' }); // O2+ ²Πg, Huber & Herzberg 1979 (from memory)
    const levels = out.levels as Array<Record<string, unknown>>;
    expect(levels[0]).toMatchObject({ label: '1σg', energyRank: 0, occupancy: 2 });
    expect(levels.reduce((sum, level) => sum + (level.occupancy as number), 0)).toBe(15);
  });

  it('huckel --chain prints x descending, pi energy, delocalization and gap', () => {
    const run = results.huckelChain;
    expect(run.code).toBe(0);
    const out = json(run);
    const golden = (1 + Math.sqrt(5)) / 2;
    // butadiene x = ±1.618, ±0.618 (science.md §5; closed form 2cos(kπ/5), Coulson 1939)
    (out.x as number[]).forEach((x, i) => expect(x).toBeCloseTo([golden, golden - 1, 1 - golden, -golden][i], 12));
    expect(out.piEnergyBeta as number).toBeCloseTo(2 * (2 * golden - 1), 12); // 2(1.618 + 0.618) = 4.472 (closed form)
    expect(out.delocalizationBeta as number).toBeCloseTo(2 * (2 * golden - 1) - 4, 12); // 0.472 β against two ethylenes (closed form)
    expect(out.homoLumoGapBeta as number).toBeCloseTo(2 * (golden - 1), 12); // 1.236 (closed form)
  });

  it('huckel --graph reads a file: allyl cation x = √2, 0, −√2 with 2 electrons', () => {
    const run = results.huckelGraph;
    expect(run.code).toBe(0);
    const out = json(run);
    (out.x as number[]).forEach((x, i) => expect(x).toBeCloseTo([Math.SQRT2, 0, -Math.SQRT2][i], 12)); // science.md §5 allyl
    expect(out.piEnergyBeta as number).toBeCloseTo(2 * Math.SQRT2, 12); // 2·√2 (closed form)
    expect(out.electronCount).toBe(2);
  });

});

describe('cli errors: status 2 and one line on stderr, nothing on stdout', () => {
  const expectations: Array<[keyof typeof cases, RegExp]> = [
    ['negativeDistance', /--r: the distance must be greater than 0 bohr, got -1/],
    ['unknownFormula', /unknown formula 'Xy2'/],
    ['unknownFlag', /unknown flag --colour for 'curve'/],
    ['missingModel', /--model is required/],
    ['h2Charges', /Za and Zb must both be 1/],
    ['electronsDoNotFit', /He2 with charge −1 has 5 electrons, more than the 4/],
    ['badGraph', /invalid Hückel graph: bonds\[0\]\.to: atom index 7 is out of range/],
  ];
  for (const [name, message] of expectations) {
    it(name, () => {
      const run = results[name];
      expect(run.code).toBe(2);
      expect(run.stdout).toBe('');
      expect(run.stderr.endsWith('\n')).toBe(true);
      expect(run.stderr.trimEnd().split('\n')).toHaveLength(1);
      expect(run.stderr).toMatch(/^error: /);
      expect(run.stderr).toMatch(message);
      expect(run.stderr).not.toMatch(/\bat .*\.ts:\d+/); // no stack trace
    });
  }
});
