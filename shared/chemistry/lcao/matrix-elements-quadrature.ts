/**
 * One-electron matrix elements over 1s Slater orbitals with unequal exponents
 * ζa on A and ζb on B, by numerical quadrature in prolate spheroidal coordinates
 *   λ = (r_a + r_b)/R ∈ [1, ∞),  μ = (r_a − r_b)/R ∈ [−1, 1],  φ ∈ [0, 2π),
 *   dV = (R³/8)(λ² − μ²) dλ dμ dφ,  r_a = R(λ + μ)/2,  r_b = R(λ − μ)/2.
 * All integrands have m = 0 (φ gives 2π), and the volume element cancels the
 * Coulomb singularities:  (λ² − μ²)/r_a = (2/R)(λ − μ),  (λ² − μ²)/r_b = (2/R)(λ + μ).
 * Kinetic energy in the symmetric gradient form T_ij = ½∫∇φ_i·∇φ_j dV with
 * ∇e^(−ζr) = −ζ r̂ e^(−ζr) and (r̂_a·r̂_b)(λ² − μ²) = λ² + μ² − 2.
 * Quadrature: λ = 1 + s/κ (κ = R(p + q)/2 for the product e^(−p r_a − q r_b)),
 * s ∈ [0, 64] in four Gauss–Legendre panels; μ in Gauss–Legendre panels of
 * width adapted to the exponent (p − q)R/2.
 * Source: coordinates and volume element: Morse & Feshbach, Methods of
 * Theoretical Physics (1953), ch. 5 (prolate spheroidal coordinates); Slater,
 * Quantum Theory of Molecules and Solids, vol. 1 (1963), appendix on two-centre
 * integrals. Quadrature: Press et al., Numerical Recipes, 3rd ed., §4.6.
 */
import { gaussLegendre } from '@shared/chemistry/numeric';
import { assertPositive } from './assert-positive';
import type { LcaoMatrixElements } from './types';

export interface UnequalExponentsInput {
  za: number;
  zb: number;
  zetaA: number;
  zetaB: number;
  distanceBohr: number;
}

export interface PairElements {
  aa: number;
  bb: number;
  ab: number;
}

export interface QuadratureMatrixElements extends LcaoMatrixElements {
  /** ⟨a|a⟩ and ⟨b|b⟩ by the same quadrature (1 to rounding; a check on the rule) */
  normA: number;
  normB: number;
  /** ⟨i| −½∇² |j⟩ */
  kinetic: PairElements;
  /** ⟨i| 1/r_a |j⟩ */
  inverseDistanceA: PairElements;
  /** ⟨i| 1/r_b |j⟩ */
  inverseDistanceB: PairElements;
}

const LAMBDA_PANELS = 4;
const LAMBDA_SPAN = 64;
const POINTS = 24;

interface PairSums {
  /** ∫ e^(…)(λ² − μ²) */
  volume: number;
  /** ∫ e^(…)(2/R)(λ − μ), i.e. with 1/r_a */
  overA: number;
  /** ∫ e^(…)(2/R)(λ + μ), i.e. with 1/r_b */
  overB: number;
  /** ∫ e^(…)(λ² + μ² − 2), i.e. with r̂_a·r̂_b */
  gradientDot: number;
}

/** ∫ e^(−p r_a − q r_b) × {1, 1/r_a, 1/r_b, r̂_a·r̂_b} dV for p + q > 0. */
function productIntegrals(p: number, q: number, distanceBohr: number): PairSums {
  const r = distanceBohr;
  const kappa = (r * (p + q)) / 2;
  const nu = (r * (p - q)) / 2;
  const { nodes, weights } = gaussLegendre(POINTS);
  const muPanels = Math.max(1, Math.ceil(Math.abs(nu) / 12));
  const muNodes: number[] = [];
  const muWeights: number[] = [];
  for (let k = 0; k < muPanels; k++) {
    const a = -1 + (2 * k) / muPanels;
    const half = 1 / muPanels;
    for (let i = 0; i < POINTS; i++) {
      muNodes.push(a + half * (1 + nodes[i]));
      muWeights.push(half * weights[i]);
    }
  }
  let volume = 0;
  let overA = 0;
  let overB = 0;
  let gradientDot = 0;
  const panelWidth = LAMBDA_SPAN / LAMBDA_PANELS;
  for (let k = 0; k < LAMBDA_PANELS; k++) {
    for (let i = 0; i < POINTS; i++) {
      const s = panelWidth * (k + 0.5 * (1 + nodes[i]));
      const lambda = 1 + s / kappa;
      const lambda2 = lambda * lambda;
      const wLambda = (0.5 * panelWidth * weights[i]) / kappa;
      for (let j = 0; j < muNodes.length; j++) {
        const mu = muNodes[j];
        // p r_a + q r_b = κλ + νμ ≥ 0, so the exponential never overflows
        const weight = wLambda * muWeights[j] * Math.exp(-(kappa + nu * mu) - s);
        volume += weight * (lambda2 - mu * mu);
        overA += weight * (lambda - mu);
        overB += weight * (lambda + mu);
        gradientDot += weight * (lambda2 + mu * mu - 2);
      }
    }
  }
  const jacobian = (2 * Math.PI * r * r * r) / 8;
  return {
    volume: jacobian * volume,
    overA: (jacobian * 2 * overA) / r,
    overB: (jacobian * 2 * overB) / r,
    gradientDot: jacobian * gradientDot,
  };
}

export function lcaoMatrixElementsQuadrature({ za, zb, zetaA, zetaB, distanceBohr }: UnequalExponentsInput): QuadratureMatrixElements {
  assertPositive('za', za);
  assertPositive('zb', zb);
  assertPositive('zetaA', zetaA);
  assertPositive('zetaB', zetaB);
  assertPositive('distanceBohr', distanceBohr);
  // normalization constants (ζ³/π)^½ of the 1s Slater functions
  const normConstA = Math.sqrt((zetaA * zetaA * zetaA) / Math.PI);
  const normConstB = Math.sqrt((zetaB * zetaB * zetaB) / Math.PI);
  const aa = productIntegrals(2 * zetaA, 0, distanceBohr);
  const bb = productIntegrals(0, 2 * zetaB, distanceBohr);
  const ab = productIntegrals(zetaA, zetaB, distanceBohr);
  const naa = normConstA * normConstA;
  const nbb = normConstB * normConstB;
  const nab = normConstA * normConstB;

  const normA = naa * aa.volume;
  const normB = nbb * bb.volume;
  const overlap = nab * ab.volume;
  const kinetic = {
    aa: 0.5 * zetaA * zetaA * normA,
    bb: 0.5 * zetaB * zetaB * normB,
    ab: 0.5 * zetaA * zetaB * nab * ab.gradientDot,
  };
  const inverseDistanceA = { aa: naa * aa.overA, bb: nbb * bb.overA, ab: nab * ab.overA };
  const inverseDistanceB = { aa: naa * aa.overB, bb: nbb * bb.overB, ab: nab * ab.overB };
  return {
    overlap,
    normA,
    normB,
    haa: kinetic.aa - za * inverseDistanceA.aa - zb * inverseDistanceB.aa,
    hbb: kinetic.bb - za * inverseDistanceA.bb - zb * inverseDistanceB.bb,
    hab: kinetic.ab - za * inverseDistanceA.ab - zb * inverseDistanceB.ab,
    kinetic,
    inverseDistanceA,
    inverseDistanceB,
  };
}
