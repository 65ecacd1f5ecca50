/**
 * What the Reference explorer draws, computed from its state with the engine
 * (pure; no DOM). Curves go through computeReference (the same code that makes
 * the references students are marked against), other minima through
 * curveMinimum, the S/J/K integrals through the LCAO closed forms, densities
 * through the density helpers, diagrams through buildMoDiagram and Hückel
 * systems through the Hückel solver.
 */
import { curve, curveMinimum, type CurveModel, type CurveState } from '@shared/chemistry/curves';
import { orbitalDensityLine, orbitalDensityPlane, type DensityLine, type DensityPlane } from '@shared/chemistry/density';
import { buildMoDiagram, type MoDiagram } from '@shared/chemistry/diatomics';
import { HuckelInputError, huckelChain, huckelGraph, huckelRing, parseHuckelGraph, type HuckelResult } from '@shared/chemistry/huckel';
import { coulombIntegral, overlapIntegral, resonanceIntegral } from '@shared/chemistry/lcao';
import { HARTREE_EV } from '@shared/chemistry/units';
import { computeReference, type CurveReference } from '@shared/exercises/reference';
import type { CurveSeries, CurveMarker, CurveSecondPanel } from '../components/curve-plot';
import type { CurveAnalysisRow } from '../components/curve-analysis-table';
import { distanceGrid, type ExplorerState } from './explorer-state';

export interface IntegralCurves {
  distanceBohr: number[];
  overlap: number[];
  coulombHartree: number[];
  resonanceHartree: number[];
  /** the exponent used at each R */
  zeta: number[];
  zetaNote: string;
}

export interface DensitySet {
  distanceBohr: number;
  zeta: number | 'opt';
  homonuclear: boolean;
  line: { bonding: DensityLine; antibonding: DensityLine };
  plane: { bonding: DensityPlane; antibonding: DensityPlane };
  extentBohr: number;
}

export interface CurveView {
  series: CurveSeries[];
  markers: CurveMarker[];
  rows: CurveAnalysisRow[];
  limitHartree: number;
  secondPanel?: CurveSecondPanel;
  description: string;
}

export type ExplorerView =
  | { kind: 'one-electron'; curves: CurveView; integrals: IntegralCurves; densities: DensitySet | null; densityError: string | null }
  | { kind: 'two-electron'; curves: CurveView }
  | { kind: 'diatomic'; diagram: MoDiagram }
  | { kind: 'huckel'; result: HuckelResult; name: string }
  | { kind: 'error'; family: ExplorerState['family']; title: string; messages: string[] };

const stateKind = (s: CurveState) => (s === 'bonding' ? 'bonding' : 'antibonding') as 'bonding' | 'antibonding';

/** The grid of a state as an exercise grid (bohr), for computeReference. */
function gridOf(state: ExplorerState) {
  const step = (state.rMaxBohr - state.rMinBohr) / (Math.max(2, state.points) - 1);
  return { unit: 'bohr' as const, start: state.rMinBohr, end: state.rMaxBohr + step * 1e-6, step };
}

function zetaChoice(zeta: number | 'opt') {
  return zeta === 'opt' ? ({ kind: 'optimized' } as const) : ({ kind: 'fixed', value: zeta } as const);
}

function fixed(value: number) {
  return { kind: 'fixed' as const, value };
}

function minimumOf(model: CurveModel, za: number, zb: number, zeta: number | 'opt', state: CurveState) {
  return curveMinimum({ model, za, zb, zeta, state });
}

/** Curves of the one-electron bond: LCAO σg/σu (and the exact ones), with the analysis of every curve. */
export function oneElectronCurves(state: ExplorerState): { view: CurveView; lcao: CurveReference } {
  const { za, zb, zeta } = state;
  const homonuclear = za === zb;
  const grid = gridOf(state);
  const variant = { family: 'one-electron' as const, key: 'explorer', za, zb, zeta: zeta === 'opt' ? ('optimized' as const) : zeta };
  const lcao = computeReference(
    { family: 'one-electron', method: 'lcao', za: fixed(za), zb: fixed(zb), zeta: zetaChoice(zeta), states: ['bonding', 'antibonding'], grid },
    variant,
  ) as CurveReference;
  const series: CurveSeries[] = lcao.curves.map((c) => ({
    id: `lcao-${c.state}`,
    label: `LCAO ${homonuclear ? (c.state === 'bonding' ? 'σg' : 'σu*') : c.state === 'bonding' ? 'lower σ' : 'upper σ*'}`,
    kind: stateKind(c.state),
    distanceBohr: lcao.grid.bohr,
    energyHartree: c.energyHartree,
  }));
  const rows: CurveAnalysisRow[] = lcao.curves.map((c, i) => ({
    id: `lcao-${c.state}`,
    label: series[i].label,
    kind: series[i].kind,
    minimum: c.state === 'bonding' ? lcao.minimum : minimumOf('lcao', za, zb, zeta, c.state),
    omegaCm1: c.state === 'bonding' ? lcao.harmonicWavenumberCm1 : null,
    limitHartree: lcao.dissociationLimitHartree,
  }));
  const markers: CurveMarker[] = [];
  if (lcao.minimum) markers.push({ id: 'lcao-min', label: 'LCAO minimum', distanceBohr: lcao.minimum.reBohr, energyHartree: lcao.minimum.energyHartree, kind: 'bonding' });

  if (state.exact) {
    const exactStates: CurveState[] = homonuclear ? ['bonding', 'antibonding'] : ['bonding'];
    const exact = computeReference(
      { family: 'one-electron', method: 'exact', za: fixed(za), zb: fixed(zb), zeta: fixed(1), states: exactStates, grid },
      { ...variant, zeta: 1 },
    ) as CurveReference;
    exact.curves.forEach((c) => {
      const label = `exact ${homonuclear ? (c.state === 'bonding' ? '1sσg' : '2pσu') : 'lowest σ'}`;
      series.push({ id: `exact-${c.state}`, label, kind: 'reference', distanceBohr: exact.grid.bohr, energyHartree: c.energyHartree, dashed: c.state === 'antibonding' });
      rows.push({
        id: `exact-${c.state}`,
        label,
        kind: 'reference',
        minimum: c.state === 'bonding' ? exact.minimum : minimumOf('exact', za, zb, 1, c.state),
        omegaCm1: c.state === 'bonding' ? exact.harmonicWavenumberCm1 : null,
        limitHartree: exact.dissociationLimitHartree,
      });
    });
    if (exact.minimum) markers.push({ id: 'exact-min', label: 'exact minimum', distanceBohr: exact.minimum.reBohr, energyHartree: exact.minimum.energyHartree, kind: 'reference' });
  }

  const zetaCurves = lcao.curves.filter((c) => c.zeta);
  const secondPanel: CurveSecondPanel | undefined = zetaCurves.length
    ? {
        title: 'Optimized orbital exponent ζ(R)',
        yLabel: 'ζ',
        csvQuantity: 'zeta',
        series: zetaCurves.map((c) => ({ id: `zeta-${c.state}`, label: `LCAO ${c.state === 'bonding' ? 'σg' : 'σu*'}`, kind: stateKind(c.state), distanceBohr: lcao.grid.bohr, values: c.zeta! })),
      }
    : undefined;

  return {
    lcao,
    view: {
      series,
      markers,
      rows,
      limitHartree: lcao.dissociationLimitHartree,
      secondPanel,
      description: `Za = ${za}, Zb = ${zb}, ${zeta === 'opt' ? 'ζ optimized at every R' : `ζ = ${zeta}`}; ${lcao.grid.bohr.length} points from ${state.rMinBohr} to ${state.rMaxBohr} a₀`,
    },
  };
}

/**
 * S, J and K against R (one exponent on both centres). With ζ optimized, each R
 * uses the optimal ζ of the bonding curve there.
 */
export function integralCurves(state: ExplorerState, lcao: CurveReference): IntegralCurves {
  const distanceBohr = lcao.grid.bohr;
  const bonding = lcao.curves.find((c) => c.state === 'bonding');
  const zeta = distanceBohr.map((_, i) => (state.zeta === 'opt' ? (bonding?.zeta?.[i] ?? 1) : state.zeta));
  return {
    distanceBohr,
    zeta,
    zetaNote: state.zeta === 'opt' ? 'at the optimized ζ(R) of the bonding curve' : `ζ = ${state.zeta}`,
    overlap: distanceBohr.map((r, i) => overlapIntegral(r, zeta[i])),
    coulombHartree: distanceBohr.map((r, i) => coulombIntegral(r, zeta[i])),
    resonanceHartree: distanceBohr.map((r, i) => resonanceIntegral(r, zeta[i])),
  };
}

/** ψ² of σg and σu at one distance, along the axis and on a plane through both nuclei. */
export function densitySet(state: ExplorerState, distanceBohr: number): DensitySet {
  const base = { za: state.za, zb: state.zb, zeta: state.zeta, distanceBohr };
  const extentBohr = Math.max(3, distanceBohr / 2 + 3);
  const line = (s: 'bonding' | 'antibonding') => orbitalDensityLine({ ...base, state: s, from: -extentBohr, to: extentBohr, points: 241 });
  const plane = (s: 'bonding' | 'antibonding') => orbitalDensityPlane({ ...base, state: s, extentBohr, nx: 101, ny: 101 });
  return {
    distanceBohr,
    zeta: state.zeta,
    homonuclear: state.za === state.zb,
    extentBohr,
    line: { bonding: line('bonding'), antibonding: line('antibonding') },
    plane: { bonding: plane('bonding'), antibonding: plane('antibonding') },
  };
}

/** Total energy at the Kołos–Wolniewicz minimum, for a marker on the H2 curves. */
// Kołos & Wolniewicz (1968): Re = 1.4011 a0, De = 4.7474 eV (science.md §3; from memory)
export const H2_EXACT_MINIMUM = { reBohr: 1.4011, deEv: 4.7474, energyHartree: -1 - 4.7474 / HARTREE_EV } as const;

const H2_METHODS = [
  { method: 'mo', label: 'simple MO', kind: 'reference' },
  { method: 'ci', label: 'MO with CI', kind: 'bonding' },
  { method: 'vb', label: 'valence bond (Heitler–London)', kind: 'other' },
] as const;

/** H2 in the minimal basis: ground state by simple MO, MO with CI and valence bond, and the triplet. */
export function twoElectronCurves(state: ExplorerState): CurveView {
  const grid = gridOf(state);
  const variant = { family: 'two-electron' as const, key: 'explorer', zeta: state.zeta === 'opt' ? ('optimized' as const) : state.zeta };
  const series: CurveSeries[] = [];
  const rows: CurveAnalysisRow[] = [];
  const zetaSeries: CurveSecondPanel['series'] = [];
  let limit = -1;
  for (const m of H2_METHODS) {
    const ref = computeReference({ family: 'two-electron', method: m.method, zeta: zetaChoice(state.zeta), grid }, variant) as CurveReference;
    const c = ref.curves[0];
    series.push({ id: `h2-${m.method}`, label: `${m.label} ¹Σg⁺`, kind: m.kind, distanceBohr: ref.grid.bohr, energyHartree: c.energyHartree, dashed: m.method === 'vb' });
    rows.push({ id: `h2-${m.method}`, label: `${m.label} ¹Σg⁺`, kind: m.kind, minimum: ref.minimum, omegaCm1: ref.harmonicWavenumberCm1, limitHartree: ref.dissociationLimitHartree });
    if (c.zeta) zetaSeries.push({ id: `zeta-${m.method}`, label: m.label, kind: m.kind, distanceBohr: ref.grid.bohr, values: c.zeta, dashed: m.method === 'vb' });
    limit = ref.dissociationLimitHartree;
  }
  const zeta = state.zeta;
  const bohr = distanceGrid(state.rMinBohr, state.rMaxBohr, state.points);
  const triplet = curve({ model: 'h2-vb', za: 1, zb: 1, zeta, state: 'antibonding' }, bohr);
  series.push({ id: 'h2-triplet', label: 'triplet ³Σu⁺', kind: 'antibonding', distanceBohr: triplet.distanceBohr, energyHartree: triplet.energyHartree });
  rows.push({ id: 'h2-triplet', label: 'triplet ³Σu⁺', kind: 'antibonding', minimum: minimumOf('h2-vb', 1, 1, zeta, 'antibonding'), omegaCm1: null, limitHartree: limit });
  const markers: CurveMarker[] = [
    { id: 'h2-exact', label: 'exact minimum (Kołos–Wolniewicz)', distanceBohr: H2_EXACT_MINIMUM.reBohr, energyHartree: H2_EXACT_MINIMUM.energyHartree, kind: 'other' },
  ];
  return {
    series,
    markers,
    rows,
    limitHartree: limit,
    secondPanel: zetaSeries.length ? { title: 'Optimized orbital exponent ζ(R)', yLabel: 'ζ', csvQuantity: 'zeta', series: zetaSeries } : undefined,
    description: `${zeta === 'opt' ? 'ζ optimized at every R' : `ζ = ${zeta}`}; ${bohr.length} points from ${state.rMinBohr} to ${state.rMaxBohr} a₀`,
  };
}

/** Hückel system of the state; a graph's JSON problems come back as messages with their place. */
export function huckelOfState(state: ExplorerState): { ok: true; result: HuckelResult; name: string } | { ok: false; messages: string[] } {
  if (state.huckelKind === 'chain') return { ok: true, result: huckelChain(state.huckelN), name: `chain of ${state.huckelN}` };
  if (state.huckelKind === 'ring') return { ok: true, result: huckelRing(state.huckelN), name: `ring of ${state.huckelN}` };
  let json: unknown;
  try {
    json = JSON.parse(state.graph);
  } catch (error) {
    return { ok: false, messages: [`The text is not valid JSON: ${error instanceof Error ? error.message : String(error)}`] };
  }
  try {
    const input = parseHuckelGraph(json);
    const result = huckelGraph(input);
    return { ok: true, result, name: input.name ?? result.name ?? 'graph' };
  } catch (error) {
    if (error instanceof HuckelInputError) return { ok: false, messages: error.issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)) };
    return { ok: false, messages: [error instanceof Error ? error.message : String(error)] };
  }
}

/** Everything the page shows for one state. Never throws: impossible input becomes an error view. */
export function computeExplorerView(state: ExplorerState): ExplorerView {
  try {
    switch (state.family) {
      case 'one-electron': {
        const { view, lcao } = oneElectronCurves(state);
        const integrals = integralCurves(state, lcao);
        const r = state.densityRBohr ?? lcao.minimum?.reBohr ?? 2;
        let densities: DensitySet | null = null;
        let densityError: string | null = null;
        try {
          densities = densitySet(state, r);
        } catch (error) {
          densityError = error instanceof Error ? error.message : String(error);
        }
        return { kind: 'one-electron', curves: view, integrals, densities, densityError };
      }
      case 'two-electron':
        return { kind: 'two-electron', curves: twoElectronCurves(state) };
      case 'diatomic':
        return { kind: 'diatomic', diagram: buildMoDiagram({ formula: state.species.trim(), order: state.order }) };
      case 'huckel': {
        const h = huckelOfState(state);
        return h.ok ? { kind: 'huckel', result: h.result, name: h.name } : { kind: 'error', family: 'huckel', title: 'The Hückel graph has problems', messages: h.messages };
      }
    }
  } catch (error) {
    return { kind: 'error', family: state.family, title: 'These parameters give no result', messages: [error instanceof Error ? error.message : String(error)] };
  }
}
