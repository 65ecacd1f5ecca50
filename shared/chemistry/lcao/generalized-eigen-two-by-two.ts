/**
 * Both roots of the 2×2 generalized symmetric eigenproblem det(H − E·S) = 0
 * with their normalized coefficient vectors (cᵀSc = 1).
 *
 * Method: scale the basis to unit diagonal overlap, then change to the
 * orthonormal symmetric/antisymmetric pair g = (a + b)/√(2(1+s)),
 * u = (a − b)/√(2(1−s)) (the eigenvectors of S; symmetric orthogonalization,
 * Löwdin, J. Chem. Phys. 18 (1950) 365). In that basis
 *   Hgg = (Haa + Hbb + 2Hab)/(2(1+s)),  Huu = (Haa + Hbb − 2Hab)/(2(1−s)),
 *   Hgu = (Haa − Hbb)/(2√(1−s²)),
 * and the ordinary symmetric 2×2 problem is solved by the Jacobi rotation
 * angle tan 2θ = 2Hgu/(Hgg − Huu) (Golub & Van Loan, Matrix Computations,
 * 4th ed., §8.5.2). This avoids the cancellation of the quadratic-formula
 * discriminant when the two roots nearly coincide (large R).
 * Requires |s| < 1 (distinct centres).
 */
import type { TwoByTwoRoot } from './types';

export interface SymmetricTwoByTwo {
  aa: number;
  bb: number;
  ab: number;
}

export function generalizedEigenTwoByTwo(
  hamiltonian: SymmetricTwoByTwo,
  overlap: SymmetricTwoByTwo,
): { lower: TwoByTwoRoot; upper: TwoByTwoRoot } {
  if (!(overlap.aa > 0 && overlap.bb > 0)) throw new RangeError('generalizedEigenTwoByTwo: overlap diagonal must be > 0');
  const scaleA = 1 / Math.sqrt(overlap.aa);
  const scaleB = 1 / Math.sqrt(overlap.bb);
  const s = overlap.ab * scaleA * scaleB;
  if (!(Math.abs(s) < 1)) throw new RangeError(`generalizedEigenTwoByTwo: |overlap| must be < 1, got ${s}`);
  const haa = hamiltonian.aa * scaleA * scaleA;
  const hbb = hamiltonian.bb * scaleB * scaleB;
  const hab = hamiltonian.ab * scaleA * scaleB;

  const hgg = (haa + hbb + 2 * hab) / (2 * (1 + s));
  const huu = (haa + hbb - 2 * hab) / (2 * (1 - s));
  const hgu = (haa - hbb) / (2 * Math.sqrt(1 - s * s));

  // Jacobi rotation: [cos θ, sin θ] and [−sin θ, cos θ] diagonalize [[hgg, hgu], [hgu, huu]].
  // (hgu = 0 exactly for Za = Zb: no rotation, so g and u stay exact)
  const theta = hgu === 0 ? 0 : 0.5 * Math.atan2(2 * hgu, hgg - huu);
  const cos = Math.cos(theta);
  const sin = Math.sin(theta);
  const first = cos * cos * hgg + 2 * sin * cos * hgu + sin * sin * huu;
  const second = sin * sin * hgg - 2 * sin * cos * hgu + cos * cos * huu;

  // back to the a, b basis: g = (a + b)/ng, u = (a − b)/nu
  const ng = Math.sqrt(2 * (1 + s));
  const nu = Math.sqrt(2 * (1 - s));
  const vector = (cg: number, cu: number): [number, number] => {
    let ca = (cg / ng + cu / nu) * scaleA;
    let cb = (cg / ng - cu / nu) * scaleB;
    // sign convention: the coefficient of larger magnitude is positive; on a tie
    // (homonuclear, to rounding) the one on A
    const dominant = Math.abs(ca) >= Math.abs(cb) * (1 - 1e-12) ? ca : cb;
    if (dominant < 0) {
      ca = -ca;
      cb = -cb;
    }
    return [ca, cb];
  };
  const [a1, b1] = vector(cos, sin);
  const [a2, b2] = vector(-sin, cos);
  const rootFirst = { energyHartree: first, coefficientA: a1, coefficientB: b1 };
  const rootSecond = { energyHartree: second, coefficientA: a2, coefficientB: b2 };
  return first <= second ? { lower: rootFirst, upper: rootSecond } : { lower: rootSecond, upper: rootFirst };
}
