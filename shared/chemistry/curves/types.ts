/**
 * One vocabulary over the potential-energy-curve models of the engine (see CONTEXT.md).
 * Atomic units throughout: bohr, hartree.
 */

/** The curve models: one-electron minimal LCAO, exact one-electron, and H2 in the minimal basis (MO, MO+CI, VB). */
export const curveModels = ['lcao', 'exact', 'h2-mo', 'h2-ci', 'h2-vb'] as const;
export type CurveModel = (typeof curveModels)[number];

/** Lower root (bonding: σg, or the H2 ground state ¹Σg⁺) or upper root (antibonding: σu, or the H2 triplet ³Σu⁺). */
export const curveStates = ['bonding', 'antibonding'] as const;
export type CurveState = (typeof curveStates)[number];

export interface CurveModelParams {
  model: CurveModel;
  /** nuclear charges; must both be 1 for the h2-* models */
  za: number;
  zb: number;
  /** orbital exponent on both centres, or 'opt' (minimized at every R); ignored by 'exact' */
  zeta: number | 'opt';
  /**
   * lcao: lower / upper root; exact: σg / σu (Za = Zb only; for Za ≠ Zb only 'bonding', the lowest state);
   * h2-*: ground state ¹Σg⁺ / triplet ³Σu⁺
   */
  state: CurveState;
}

export interface CurvePointResult {
  /** total energy: electronic + Za·Zb/R */
  energyHartree: number;
  electronicHartree: number;
  /** the optimal exponent at this R (only when zeta = 'opt' and the model has one) */
  zeta?: number;
}

export interface CurveResult {
  distanceBohr: number[];
  /** total energies: electronic + Za·Zb/R */
  energyHartree: number[];
  electronicHartree: number[];
  /** the optimal exponent at each R (only when zeta = 'opt' and the model has one) */
  zeta?: number[];
}

export interface CurveMinimumResult {
  /** equilibrium distance, bohr */
  reBohr: number;
  /** total energy at Re */
  energyHartree: number;
  /** dissociation energy against `dissociationLimit` of the same parameters, eV */
  deEv: number;
  /** De in hartree */
  deHartree: number;
  /** the exponent at Re (the fixed one, or the optimum there); absent for 'exact' */
  zeta?: number;
}
