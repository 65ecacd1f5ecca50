/**
 * Shapes of the exact (Born–Oppenheimer, clamped nuclei) one-electron
 * two-centre model. Atomic units throughout.
 */

/** 1sσg (lowest state) or 2pσu (lowest ungerade state, only when Za = Zb). */
export type ExactState = 'sigma-g' | 'sigma-u';

/** Which Legendre functions P_l enter the angular expansion. */
export type AngularParity = 'even' | 'odd' | 'all';

export interface ExactInput {
  za: number;
  zb: number;
  distanceBohr: number;
  /** default 'sigma-g'; for Za ≠ Zb only the lowest state exists here and 'sigma-u' throws */
  state?: ExactState;
}

export interface ExactEnergy {
  /** electronic energy E_el (without nuclear repulsion) */
  electronicHartree: number;
  /** E_el + Za·Zb/R */
  totalHartree: number;
  /** the separation constant A shared by the angular and radial equations */
  separationConstant: number;
}

/** A symmetric banded matrix: main diagonal and the first two superdiagonals (zero-filled when absent). */
export interface SymmetricBanded {
  diagonal: Float64Array;
  /** element (i, i+1) at index i; length n − 1 */
  upper1: Float64Array;
  /** element (i, i+2) at index i; length n − 2 */
  upper2: Float64Array;
}
