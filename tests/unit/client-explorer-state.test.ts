import { describe, expect, it } from 'vitest';
import { BOHR_ANGSTROM } from '@shared/chemistry/units';
import {
  DEFAULT_EXPLORER_STATE,
  distanceGrid,
  explorerSearchParams,
  parseExplorerState,
  type ExplorerState,
} from '@client/features/explorer/lib/explorer-state';
import { computeExplorerView, huckelOfState } from '@client/features/explorer/lib/explorer-compute';
import { curvesCsv } from '@client/features/explorer/components/curve-plot';
import { moLevelsCsv } from '@client/features/explorer/components/mo-diagram-view';
import { describeMoDiagram } from '@client/features/explorer/components/mo-diagram-svg';
import { huckelLevelsCsv } from '@client/features/explorer/components/huckel-levels';
import { buildMoDiagram } from '@shared/chemistry/diatomics';
import { huckelChain } from '@shared/chemistry/huckel';

const D = DEFAULT_EXPLORER_STATE;
const withState = (change: Partial<ExplorerState>): ExplorerState => ({ ...D, ...change });

describe('explorer state in the URL', () => {
  it('reads the defaults from an empty search string and writes nothing for them', () => {
    const { state, ignored } = parseExplorerState(new URLSearchParams(''));
    expect(state).toEqual(D);
    expect(ignored).toEqual([]);
    expect(explorerSearchParams(D).toString()).toBe('');
  });

  it('round-trips a changed state', () => {
    const state = withState({ family: 'diatomic', species: 'O2+', order: 'unmixed', distanceUnit: 'pm', energyUnit: 'cm-1', zeta: 'opt', exact: false, densityRBohr: 1.5 });
    const params = explorerSearchParams(state);
    expect(params.get('f')).toBe('diatomic');
    expect(params.get('sp')).toBe('O2+');
    expect(params.get('zeta')).toBe('opt');
    expect(params.get('exact')).toBe('0');
    expect(parseExplorerState(new URLSearchParams(params.toString())).state).toEqual(state);
  });

  it('falls back to defaults for unusable values and says which', () => {
    const { state, ignored } = parseExplorerState(new URLSearchParams('f=quantum&du=nm&za=-3&zeta=zero&pts=3.5&rmin=9&rmax=2&hk=ring&hn=2'));
    expect(state.family).toBe(D.family);
    expect(state.distanceUnit).toBe('bohr');
    expect(state.za).toBe(D.za);
    expect(state.zeta).toBe(D.zeta);
    expect(state.points).toBe(D.points);
    expect([state.rMinBohr, state.rMaxBohr]).toEqual([D.rMinBohr, D.rMaxBohr]);
    // a ring needs at least 3 atoms
    expect(state.huckelKind).toBe('ring');
    expect(state.huckelN).toBe(4);
    expect(ignored).toEqual(expect.arrayContaining(['f', 'du', 'za', 'zeta', 'pts', 'rmin', 'rmax', 'hn']));
  });

  it('makes an even grid that ends exactly at R max', () => {
    const grid = distanceGrid(0.6, 8, 75);
    expect(grid.length).toBe(75);
    expect(grid[0]).toBe(0.6);
    expect(grid[74]).toBe(8);
    expect(grid[14]).toBeCloseTo(2, 12);
  });
});

describe('what the explorer computes', () => {
  it('gives LCAO and exact minima of the one-electron bond', () => {
    const view = computeExplorerView(D);
    if (view.kind !== 'one-electron') throw new Error(view.kind);
    const row = (id: string) => view.curves.rows.find((r) => r.id === id)!;
    // ζ = 1: Re = 2.493 a0, E(Re) = −0.56483 Eh (science.md §1; classic LCAO result, computed)
    expect(row('lcao-bonding').minimum!.reBohr).toBeCloseTo(2.493, 3);
    expect(row('lcao-bonding').minimum!.energyHartree).toBeCloseTo(-0.56483, 5);
    // the LCAO σu curve is repulsive
    expect(row('lcao-antibonding').minimum).toBeNull();
    // exact: Re = 1.997 a0, E(Re) = −0.60263 Eh (science.md §2; Bates, Ledsham & Stewart 1953, from memory)
    expect(row('exact-bonding').minimum!.reBohr).toBeCloseTo(1.997, 3);
    expect(row('exact-bonding').minimum!.energyHartree).toBeCloseTo(-0.60263, 5);
    expect(view.curves.series.map((s) => s.kind)).toEqual(['bonding', 'antibonding', 'reference', 'reference']);
    // S at R = 2 a0, ζ = 1: 0.586453 (science.md §1, computed); the 15th grid point is R = 2
    expect(view.integrals.distanceBohr[14]).toBeCloseTo(2, 12);
    expect(view.integrals.overlap[14]).toBeCloseTo(0.586453, 6);
    // K = (1 + R)e^(−R) and J = (1/R)[1 − (1 + R)e^(−2R)] at R = 2, ζ = 1 (science.md §1)
    expect(view.integrals.resonanceHartree[14]).toBeCloseTo(3 * Math.exp(-2), 12);
    expect(view.integrals.coulombHartree[14]).toBeCloseTo(0.5 * (1 - 3 * Math.exp(-4)), 12);
  });

  it('draws densities at the LCAO minimum with the σu node at the midpoint', () => {
    const view = computeExplorerView(D);
    if (view.kind !== 'one-electron' || !view.densities) throw new Error('no densities');
    const set = view.densities;
    expect(set.distanceBohr).toBeCloseTo(2.493, 3);
    const mid = (d: number[][]) => d[(d.length - 1) / 2][(d[0].length - 1) / 2];
    // the plane grid is odd, so its centre is the midpoint: σu vanishes there, σg does not
    expect(mid(set.plane.antibonding.density)).toBeLessThan(1e-15);
    expect(mid(set.plane.bonding.density)).toBeGreaterThan(0.01);
  });

  it('uses ζ(R) of the bonding curve for S, J, K when ζ is optimized', () => {
    const view = computeExplorerView(withState({ zeta: 'opt', exact: false }));
    if (view.kind !== 'one-electron') throw new Error(view.kind);
    // ζ = 1.238 at Re = 2.003 a0 (science.md §1; Finkelstein & Horowitz 1928, from memory)
    expect(view.curves.rows[0].minimum!.reBohr).toBeCloseTo(2.003, 3);
    expect(view.curves.rows[0].minimum!.zeta).toBeCloseTo(1.238, 3);
    expect(view.curves.secondPanel?.series.length).toBe(2);
    expect(new Set(view.integrals.zeta).size).toBeGreaterThan(10);
  });

  it('compares the H2 models', () => {
    const view = computeExplorerView(withState({ family: 'two-electron' }));
    if (view.kind !== 'two-electron') throw new Error(view.kind);
    const re = (id: string) => view.curves.rows.find((r) => r.id === id)!.minimum!.reBohr;
    // ζ = 1: MO Re = 1.603 a0, VB Re = 1.643 a0 (science.md §3; Levine ch. 13, from memory; computed)
    expect(re('h2-mo')).toBeCloseTo(1.603, 3);
    expect(re('h2-vb')).toBeCloseTo(1.643, 3);
    expect(view.curves.rows.find((r) => r.id === 'h2-triplet')!.minimum).toBeNull();
  });

  it('reports unknown species and bad Hückel graphs as messages, not exceptions', () => {
    const bad = computeExplorerView(withState({ family: 'diatomic', species: 'Xe2' }));
    expect(bad.kind).toBe('error');
    const json = huckelOfState(withState({ huckelKind: 'graph', graph: '{"atoms": [' }));
    expect(json.ok).toBe(false);
    if (!json.ok) expect(json.messages[0]).toMatch(/^The text is not valid JSON/);
    const graph = huckelOfState(withState({ huckelKind: 'graph', graph: '{"atoms": ["C", "C"], "bonds": [[0, 2]]}' }));
    if (graph.ok) throw new Error('expected problems');
    expect(graph.messages.join(' ')).toContain('bonds[0].to');
  });

  it('solves the default graph (pyridine) and chains', () => {
    const pyridine = huckelOfState(withState({ huckelKind: 'graph' }));
    if (!pyridine.ok) throw new Error(pyridine.messages.join('; '));
    expect(pyridine.name).toBe('pyridine');
    expect(pyridine.result.electronCount).toBe(6);
    const butadiene = huckelOfState(withState({ huckelKind: 'chain', huckelN: 4 }));
    if (!butadiene.ok) throw new Error('chain failed');
    // butadiene x = ±1.618, ±0.618 (science.md §5)
    expect(butadiene.result.xValues.map((x) => Number(x.toFixed(3)))).toEqual([1.618, 0.618, -0.618, -1.618]);
  });
});

describe('data downloads', () => {
  it('writes curve CSV in the chosen units with the units in the header', () => {
    const text = curvesCsv(
      [
        { id: 'a', label: 'LCAO σg', kind: 'bonding', distanceBohr: [1, 2], energyHartree: [-0.5, -0.55] },
        { id: 'b', label: '=trap', kind: 'other', distanceBohr: [1, 2], energyHartree: [0, 0.1] },
      ],
      { distance: 'angstrom', energy: 'ev' },
    );
    const lines = text.trimEnd().split('\r\n');
    // headers name quantity and unit; a label inside a header cannot start a formula ("E …")
    expect(lines[0]).toBe('R / angstrom,E LCAO σg / eV,E =trap / eV');
    const [r, e] = lines[2].split(',').map(Number);
    expect(r).toBeCloseTo(2 * BOHR_ANGSTROM, 10);
    expect(e).toBeCloseTo(-0.55 * 27.211386245988, 8); // CODATA 2018
    expect(lines.length).toBe(3);
  });

  it('writes Hückel levels with their coefficients', () => {
    const text = curvesCsv([{ id: 'x', label: 'x', kind: 'other', distanceBohr: [1], energyHartree: [1] }], { distance: 'bohr', energy: 'hartree' });
    expect(text.split('\r\n')[0]).toBe('R / bohr,E x / hartree');
    const huckel = huckelLevelsCsv(huckelChain(2)).split('\r\n');
    expect(huckel[0]).toBe('orbital,x (E = alpha + x beta),occupancy,degeneracy,character,c(C1),c(C2)');
    // ethylene x = +1 (bonding, 2 electrons) and −1 (science.md §5 closed form 2cos(kπ/3))
    expect(huckel[1].split(',').slice(0, 5)).toEqual(['1', '1', '2', '1', 'bonding']);
    expect(huckel[2].split(',').slice(0, 5)).toEqual(['2', '-1', '0', '1', 'antibonding']);
  });

  it('describes and lists the O2 diagram', () => {
    const d = buildMoDiagram({ formula: 'O2' });
    // O2: ³Σg⁻, bond order 2 (science.md §4, Huber & Herzberg 1979, from memory)
    expect(describeMoDiagram(d)).toContain('ground term ³Σg⁻; bond order 2; 2 unpaired electrons, paramagnetic');
    const rows = moLevelsCsv(d).trimEnd().split('\r\n');
    expect(rows.length).toBe(1 + d.levels.length);
    expect(rows.find((r) => r.startsWith('1πg*'))).toContain('HOMO and LUMO');
  });
});

describe('answer key rows', () => {
  it('lists each variant with its answers in the chosen units', async () => {
    const { answerCells, answerColumns, answerKeyCsv, variantLabel } = await import('@client/features/explorer/lib/answer-key');
    const { computeReference } = await import('@shared/exercises/reference');
    const { allVariants } = await import('@shared/exercises/variants');
    const model = {
      family: 'one-electron' as const,
      method: 'lcao' as const,
      za: { kind: 'fixed' as const, value: 1 },
      zb: { kind: 'fixed' as const, value: 1 },
      zeta: { kind: 'list' as const, values: [1, 1.2] },
      states: ['bonding' as const, 'antibonding' as const],
      grid: { unit: 'bohr' as const, start: 1, end: 4, step: 0.5 },
    };
    const units = { distance: 'angstrom' as const, energy: 'ev' as const };
    const variants = allVariants(model);
    expect(variants.map(variantLabel)).toEqual(['Za = 1, Zb = 1, ζ = 1', 'Za = 1, Zb = 1, ζ = 1.2']);
    expect(answerColumns('one-electron', units).map((c) => c.header)).toEqual(['Rₑ / Å', 'E(Rₑ) / eV', 'Dₑ / eV', 'ωₑ / cm⁻¹', 'Antibonding repulsive']);
    const cells = answerCells(computeReference(model, variants[0]), units);
    // ζ = 1: Re = 2.493 a0 = 1.3191 Å, De = 1.764 eV (science.md §1, computed)
    expect(cells[0].text).toBe('1.3191');
    expect(Number(cells[2].raw)).toBeCloseTo(1.764, 3);
    expect(cells[4].text).toBe('yes');
    const csv = answerKeyCsv('one-electron', units, [{ variant: variants[0], cells, error: null }, { variant: variants[1], cells: null, error: '=oops' }]).trimEnd().split('\r\n');
    expect(csv[0]).toBe('variant,Re / angstrom,E(Re) / eV,De / eV,omega_e / cm-1,antibonding repulsive,problem');
    // an error text that starts like a formula is guarded
    expect(csv[2]).toBe("\"Za = 1, Zb = 1, ζ = 1.2\",,,,,,'=oops");
  });

  it('gives the MO answers of O2+', async () => {
    const { answerCells } = await import('@client/features/explorer/lib/answer-key');
    const { computeReference } = await import('@shared/exercises/reference');
    const ref = computeReference({ family: 'diatomic', species: ['O2+'], order: 'auto' }, { family: 'diatomic', key: 'species=O2+', species: 'O2+' });
    const cells = answerCells(ref, { distance: 'angstrom', energy: 'hartree' });
    // O2+: ²Πg, bond order 2.5 (science.md §4, Huber & Herzberg 1979, from memory)
    expect(cells.map((c) => c.text).slice(1)).toEqual(['2.5', '1', '²Πg', 'paramagnetic']);
  });
});
