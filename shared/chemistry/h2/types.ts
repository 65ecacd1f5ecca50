/** Shared vocabulary of the two-electron H2 model (see CONTEXT.md). */

/** Wave-function model. `mo`: one σg² determinant; `ci`: σg² and σu² mixed; `vb`: Heitler–London. */
export const h2Methods = ['mo', 'ci', 'vb'] as const;
export type H2Method = (typeof h2Methods)[number];

/** `ground`: lowest ¹Σg⁺ state of the model; `triplet`: ³Σu⁺ (σg σu), the repulsive state. */
export const h2States = ['ground', 'triplet'] as const;
export type H2State = (typeof h2States)[number];

/** Where the basis sits: one 1s exponent ζ on both protons, internuclear distance R (bohr). */
export interface H2Geometry {
  zeta: number;
  distanceBohr: number;
}

export interface H2Energy {
  /** electronic energy plus nuclear repulsion 1/R, hartree */
  totalHartree: number;
  /** electronic energy alone, hartree */
  electronicHartree: number;
}

/** Throws RangeError unless ζ > 0 and R > 0 are finite numbers. */
export function assertGeometry({ zeta, distanceBohr }: H2Geometry, where: string): void {
  if (!(Number.isFinite(zeta) && zeta > 0)) throw new RangeError(`${where}: zeta must be a positive number, got ${zeta}`);
  if (!(Number.isFinite(distanceBohr) && distanceBohr > 0)) {
    throw new RangeError(`${where}: distanceBohr must be a positive number, got ${distanceBohr}`);
  }
}
