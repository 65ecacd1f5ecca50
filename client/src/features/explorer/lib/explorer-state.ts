/**
 * The Reference explorer's state lives in the URL's search string, so that
 * any view can be bookmarked and shared. Parsing never throws: unknown or
 * out-of-range values fall back to the defaults (and are named in `ignored`).
 * Distances in the URL are always in bohr, whatever unit is displayed.
 */
import { isDistanceUnit, isEnergyUnit, type DistanceUnit, type EnergyUnit } from './units';

export const explorerFamilies = ['one-electron', 'two-electron', 'diatomic', 'huckel'] as const;
export type ExplorerFamily = (typeof explorerFamilies)[number];

export const familyLabel: Record<ExplorerFamily, string> = {
  'one-electron': 'One-electron bond (H₂⁺-like)',
  'two-electron': 'Two-electron bond (H₂)',
  diatomic: 'MO diagram of a diatomic',
  huckel: 'Hückel π system',
};

export type HuckelKind = 'chain' | 'ring' | 'graph';
export type LevelOrder = 'auto' | 'mixed' | 'unmixed';

export interface ExplorerState {
  family: ExplorerFamily;
  distanceUnit: DistanceUnit;
  energyUnit: EnergyUnit;
  /** nuclear charges (one-electron) */
  za: number;
  zb: number;
  /** orbital exponent, or 'opt' (optimized at every R) */
  zeta: number | 'opt';
  /** R range of the curves, bohr */
  rMinBohr: number;
  rMaxBohr: number;
  /** grid points of the curves */
  points: number;
  /** draw the exact one-electron curves beside the LCAO ones */
  exact: boolean;
  /** R at which densities are drawn, bohr; null = at the LCAO Re */
  densityRBohr: number | null;
  species: string;
  order: LevelOrder;
  huckelKind: HuckelKind;
  huckelN: number;
  /** JSON text of a Hückel graph */
  graph: string;
}

export const DEFAULT_GRAPH = [
  '{',
  '  "name": "pyridine",',
  '  "atoms": ["N-pyridine", "C", "C", "C", "C", "C"],',
  '  "bonds": [[0, 1], [1, 2], [2, 3], [3, 4], [4, 5], [5, 0]]',
  '}',
].join('\n');

export const DEFAULT_EXPLORER_STATE: ExplorerState = {
  family: 'one-electron',
  distanceUnit: 'bohr',
  energyUnit: 'hartree',
  za: 1,
  zb: 1,
  zeta: 1,
  rMinBohr: 0.6,
  rMaxBohr: 8,
  points: 75,
  exact: true,
  densityRBohr: null,
  species: 'N2',
  order: 'auto',
  huckelKind: 'chain',
  huckelN: 4,
  graph: DEFAULT_GRAPH,
};

/** Limits of the form (kept modest so that every view stays quick in the browser). */
export const LIMITS = {
  charge: { min: 0.5, max: 10 },
  zeta: { min: 0.1, max: 10 },
  rBohr: { min: 0.1, max: 40 },
  points: { min: 10, max: 400 },
  huckelN: { chain: { min: 2, max: 40 }, ring: { min: 3, max: 40 } },
} as const;

const KEYS = {
  family: 'f',
  distanceUnit: 'du',
  energyUnit: 'eu',
  za: 'za',
  zb: 'zb',
  zeta: 'zeta',
  rMinBohr: 'rmin',
  rMaxBohr: 'rmax',
  points: 'pts',
  exact: 'exact',
  densityRBohr: 'rd',
  species: 'sp',
  order: 'ord',
  huckelKind: 'hk',
  huckelN: 'hn',
  graph: 'g',
} as const satisfies Record<keyof ExplorerState, string>;

function numberIn(text: string | null, min: number, max: number): number | null {
  if (text === null || text.trim() === '') return null;
  const value = Number(text);
  return Number.isFinite(value) && value >= min && value <= max ? value : null;
}

export interface ParsedExplorerState {
  state: ExplorerState;
  /** search keys whose values were not usable */
  ignored: string[];
}

export function parseExplorerState(params: URLSearchParams): ParsedExplorerState {
  const d = DEFAULT_EXPLORER_STATE;
  const ignored: string[] = [];
  const read = <T>(key: string, parse: (text: string) => T | null, fallback: T): T => {
    const text = params.get(key);
    if (text === null) return fallback;
    const value = parse(text);
    if (value === null) {
      ignored.push(key);
      return fallback;
    }
    return value;
  };
  const family = read(KEYS.family, (t) => ((explorerFamilies as readonly string[]).includes(t) ? (t as ExplorerFamily) : null), d.family);
  const distanceUnit = read(KEYS.distanceUnit, (t) => (isDistanceUnit(t) ? t : null), d.distanceUnit);
  const energyUnit = read(KEYS.energyUnit, (t) => (isEnergyUnit(t) ? t : null), d.energyUnit);
  const za = read(KEYS.za, (t) => numberIn(t, LIMITS.charge.min, LIMITS.charge.max), d.za);
  const zb = read(KEYS.zb, (t) => numberIn(t, LIMITS.charge.min, LIMITS.charge.max), d.zb);
  const zeta = read<number | 'opt'>(KEYS.zeta, (t) => (t === 'opt' ? 'opt' : numberIn(t, LIMITS.zeta.min, LIMITS.zeta.max)), d.zeta);
  let rMinBohr = read(KEYS.rMinBohr, (t) => numberIn(t, LIMITS.rBohr.min, LIMITS.rBohr.max), d.rMinBohr);
  let rMaxBohr = read(KEYS.rMaxBohr, (t) => numberIn(t, LIMITS.rBohr.min, LIMITS.rBohr.max), d.rMaxBohr);
  if (!(rMaxBohr > rMinBohr)) {
    ignored.push(KEYS.rMinBohr, KEYS.rMaxBohr);
    rMinBohr = d.rMinBohr;
    rMaxBohr = d.rMaxBohr;
  }
  const points = read(KEYS.points, (t) => {
    const n = numberIn(t, LIMITS.points.min, LIMITS.points.max);
    return n !== null && Number.isInteger(n) ? n : null;
  }, d.points);
  const exact = read(KEYS.exact, (t) => (t === '1' ? true : t === '0' ? false : null), d.exact);
  const densityRBohr = read<number | null>(KEYS.densityRBohr, (t) => numberIn(t, LIMITS.rBohr.min, LIMITS.rBohr.max), d.densityRBohr);
  const species = read(KEYS.species, (t) => (/^[A-Za-z0-9+\-^ ]{1,12}$/.test(t) ? t : null), d.species);
  const order = read(KEYS.order, (t) => (t === 'auto' || t === 'mixed' || t === 'unmixed' ? t : null), d.order);
  const huckelKind = read(KEYS.huckelKind, (t) => (t === 'chain' || t === 'ring' || t === 'graph' ? t : null), d.huckelKind);
  const nLimits = huckelKind === 'ring' ? LIMITS.huckelN.ring : LIMITS.huckelN.chain;
  const huckelN = read(KEYS.huckelN, (t) => {
    const n = numberIn(t, nLimits.min, nLimits.max);
    return n !== null && Number.isInteger(n) ? n : null;
  }, Math.max(d.huckelN, nLimits.min));
  const graph = read(KEYS.graph, (t) => (t.length <= 20_000 ? t : null), d.graph);
  return {
    state: { family, distanceUnit, energyUnit, za, zb, zeta, rMinBohr, rMaxBohr, points, exact, densityRBohr, species, order, huckelKind, huckelN, graph },
    ignored,
  };
}

/** The search string of a state; values equal to the defaults are left out (short, stable links). */
export function explorerSearchParams(state: ExplorerState): URLSearchParams {
  const params = new URLSearchParams();
  const d = DEFAULT_EXPLORER_STATE;
  (Object.keys(KEYS) as (keyof ExplorerState)[]).forEach((key) => {
    const value = state[key];
    if (value === d[key]) return;
    if (value === null) return;
    params.set(KEYS[key], typeof value === 'boolean' ? (value ? '1' : '0') : String(value));
  });
  // a density distance of null is the default: nothing to write
  return params;
}

/** The state with some fields changed, as a search string (for setSearchParams). */
export function withExplorerChange(state: ExplorerState, change: Partial<ExplorerState>): URLSearchParams {
  return explorerSearchParams({ ...state, ...change });
}

/** Evenly spaced distances from rMin to rMax (both included). */
export function distanceGrid(rMinBohr: number, rMaxBohr: number, points: number): number[] {
  const n = Math.max(2, Math.round(points));
  return Array.from({ length: n }, (_, i) => (i === n - 1 ? rMaxBohr : rMinBohr + ((rMaxBohr - rMinBohr) * i) / (n - 1)));
}
