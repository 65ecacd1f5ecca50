/**
 * The Reference of a variant: the curves and answer key Bondmark computes
 * itself from the published models (engine in shared/chemistry). The same
 * function feeds the lecturer's previews, the personal templates and the
 * marking, so they can never disagree.
 */
import { curve, curveMinimum, curvePoint, dissociationLimit, type CurveModel, type CurveModelParams, type CurveState } from '../chemistry/curves';
import { buildMoDiagram, type MoDiagram } from '../chemistry/diatomics';
import { huckelChain, huckelGraph, huckelRing, parseHuckelGraph, type HuckelResult } from '../chemistry/huckel';
import { harmonicWavenumber, reducedMassMe } from '../chemistry/analysis';
import { distanceToBohr } from '../chemistry/units';
import type { HuckelSystem, ModelSpec } from './spec';
import { gridValues, type Variant } from './variants';

/** Bumped whenever a change in the engine changes any reference value (stored with every mark). */
export const ENGINE_VERSION = '2026.12.1';

export interface ReferenceCurve {
  state: CurveState;
  /** e.g. "bonding (σg)", "ground state ¹Σg⁺" */
  label: string;
  energyHartree: number[];
  /** optimal exponent at each grid point, when ζ is optimized */
  zeta?: number[];
}

export interface CurveReference {
  kind: 'curve';
  model: CurveModel;
  params: Omit<CurveModelParams, 'state'>;
  grid: { unit: 'bohr' | 'angstrom' | 'pm'; values: number[]; bohr: number[] };
  curves: ReferenceCurve[];
  /** minimum of the first (bonding / ground) curve, found on the model itself, not on the grid */
  minimum: { reBohr: number; energyHartree: number; deEv: number; deHartree: number; zeta?: number } | null;
  dissociationLimitHartree: number;
  /** harmonic wavenumber at Re for the given isotopes, cm⁻¹ */
  harmonicWavenumberCm1: number | null;
  isotopes: [string, string];
  /** the upper curve has no minimum (only when an antibonding curve is part of the exercise) */
  antibondingRepulsive: boolean | null;
}

export interface DiagramReference {
  kind: 'diagram';
  species: string;
  diagram: MoDiagram;
  answers: { configuration: string; bondOrder: number; unpairedElectrons: number; termSymbol: string; magnetism: string };
}

export interface HuckelReference {
  kind: 'huckel';
  systemLabel: string;
  result: HuckelResult;
  answers: { x: number[]; piEnergyBeta: number; delocalizationBeta: number; homoLumoGapBeta: number | null };
}

export type Reference = CurveReference | DiagramReference | HuckelReference;

const stateLabel = (model: CurveModel, state: CurveState, za: number, zb: number): string => {
  if (model.startsWith('h2-')) return state === 'bonding' ? 'ground state ¹Σg⁺' : 'triplet ³Σu⁺';
  if (za !== zb) return state === 'bonding' ? 'lower (bonding) σ' : 'upper (antibonding) σ*';
  return state === 'bonding' ? 'bonding σg' : 'antibonding σu*';
};

/** Harmonic wavenumber from the model's own second derivative at Re (central difference, h = 1e-3 a0). */
function wavenumberAt(params: CurveModelParams, reBohr: number, isotopes: [string, string], nuclear: boolean): number | null {
  const h = 1e-3;
  const e = (r: number) => curvePoint(params, r).energyHartree;
  const k = (e(reBohr + h) - 2 * e(reBohr) + e(reBohr - h)) / (h * h);
  if (!(k > 0)) return null;
  const mu = reducedMassMe(isotopes, { masses: nuclear ? 'nuclear' : 'atomic' });
  return harmonicWavenumber({ curvatureHartreePerBohr2: k, reducedMassMe: mu });
}

function huckelOf(system: HuckelSystem): HuckelResult {
  if (system.kind === 'chain') return huckelChain(system.n);
  if (system.kind === 'ring') return huckelRing(system.n);
  return huckelGraph({ ...parseHuckelGraph(system.graph), name: system.name });
}

export interface ReferenceOptions {
  /** isotopes for ωe; default 1H–1H */
  isotopes?: [string, string];
}

/** The Reference of one variant of an exercise's model. Throws RangeError for impossible input. */
export function computeReference(model: ModelSpec, variant: Variant, options: ReferenceOptions = {}): Reference {
  if (model.family !== variant.family) throw new RangeError(`variant of a ${variant.family} exercise given for a ${model.family} model`);
  if ((model.family === 'one-electron' && variant.family === 'one-electron') || (model.family === 'two-electron' && variant.family === 'two-electron')) {
    const curveModel: CurveModel = model.family === 'one-electron' ? model.method : (`h2-${model.method}` as CurveModel);
    const za = variant.family === 'one-electron' ? variant.za : 1;
    const zb = variant.family === 'one-electron' ? variant.zb : 1;
    const zeta = variant.zeta === 'optimized' ? 'opt' : variant.zeta;
    const states: CurveState[] = model.family === 'one-electron' ? model.states : ['bonding'];
    const values = gridValues(model.grid);
    const bohr = values.map((v) => distanceToBohr(v, model.grid.unit));
    const base = { model: curveModel, za, zb, zeta } as const;
    const curves = states.map((state) => {
      const c = curve({ ...base, state }, bohr);
      return { state, label: stateLabel(curveModel, state, za, zb), energyHartree: c.energyHartree, ...(c.zeta ? { zeta: c.zeta } : {}) };
    });
    const first: CurveModelParams = { ...base, state: states.includes('bonding') ? 'bonding' : states[0] };
    const minimum = curveMinimum(first);
    const isotopes = options.isotopes ?? ['1H', '1H'];
    // one-electron systems are bare nuclei (nuclear masses); H2 uses atomic masses
    const omega = minimum ? wavenumberAt(first, minimum.reBohr, isotopes, model.family === 'one-electron') : null;
    const antibondingRepulsive = states.includes('antibonding') ? curveMinimum({ ...base, state: 'antibonding' }) === null : null;
    return {
      kind: 'curve',
      model: curveModel,
      params: base,
      grid: { unit: model.grid.unit, values, bohr },
      curves,
      minimum,
      dissociationLimitHartree: dissociationLimit(first),
      harmonicWavenumberCm1: omega,
      isotopes,
      antibondingRepulsive,
    };
  }
  if (model.family === 'diatomic' && variant.family === 'diatomic') {
    const diagram = buildMoDiagram({ formula: variant.species, order: model.order });
    return {
      kind: 'diagram',
      species: variant.species,
      diagram,
      answers: {
        configuration: diagram.configuration,
        bondOrder: diagram.bondOrder,
        unpairedElectrons: diagram.unpairedElectrons,
        termSymbol: diagram.termSymbol.text,
        magnetism: diagram.magnetism,
      },
    };
  }
  if (model.family === 'huckel' && variant.family === 'huckel') {
    const result = huckelOf(variant.system);
    return {
      kind: 'huckel',
      systemLabel: variant.system.kind === 'graph' ? variant.system.name : `${variant.system.kind} of ${variant.system.n}`,
      result,
      answers: { x: result.xValues, piEnergyBeta: result.totalPiEnergyBeta, delocalizationBeta: result.delocalizationEnergyBeta, homoLumoGapBeta: result.homoLumoGapBeta },
    };
  }
  throw new RangeError('unsupported model');
}
