/**
 * Shapes shared by the minimal-LCAO model of the one-electron two-centre bond
 * (1s Slater orbitals on nuclei A and B). Atomic units throughout.
 */

/** The lower (bonding, σg when Za = Zb) or upper (antibonding, σu) root of the 2×2 problem. */
export type LcaoState = 'bonding' | 'antibonding';

/** Two nuclei of charge `za`, `zb` at distance `distanceBohr`, one exponent `zeta` on both 1s orbitals. */
export interface LcaoInput {
  za: number;
  zb: number;
  zeta: number;
  distanceBohr: number;
}

/** Electronic one-electron matrix elements over normalized 1s orbitals a and b (hartree). */
export interface LcaoMatrixElements {
  /** S = ⟨a|b⟩ */
  overlap: number;
  /** ⟨a|h|a⟩ */
  haa: number;
  /** ⟨b|h|b⟩ */
  hbb: number;
  /** ⟨a|h|b⟩ */
  hab: number;
}

/** One root of det(H − E·S) = 0 with its orbital ψ = ca·φa + cb·φb, normalized (cᵀSc = 1). */
export interface TwoByTwoRoot {
  energyHartree: number;
  coefficientA: number;
  coefficientB: number;
}

export interface LcaoEnergies {
  /** total energy of the lower root, electronic + Za·Zb/R */
  bondingHartree: number;
  /** total energy of the upper root, electronic + Za·Zb/R */
  antibondingHartree: number;
  bondingElectronicHartree: number;
  antibondingElectronicHartree: number;
  nuclearRepulsionHartree: number;
  overlap: number;
  haa: number;
  hbb: number;
  hab: number;
  /** orbital coefficients on φa and φb, normalized */
  bonding: { coefficientA: number; coefficientB: number };
  antibonding: { coefficientA: number; coefficientB: number };
}
