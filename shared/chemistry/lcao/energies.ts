/**
 * Bonding and antibonding energies of the minimal-LCAO one-electron bond:
 * roots of the 2×2 generalized problem det(H − E·S) = 0 over 1s Slater
 * orbitals on A and B (any Za, Zb), plus the nuclear repulsion Za·Zb/R.
 * Homonuclear limit: E± = (Haa ± Hab)/(1 ± S) + Z²/R.
 * Source: Pauling & Wilson, Introduction to Quantum Mechanics (1935) ch. XII §42
 * (secular equation of the linear variation method); Finkelstein & Horowitz,
 * Z. Phys. 48 (1928) 118 (exponent ζ as a parameter).
 */
import { generalizedEigenTwoByTwo } from './generalized-eigen-two-by-two';
import { lcaoMatrixElements } from './matrix-elements';
import type { LcaoEnergies, LcaoInput, LcaoMatrixElements } from './types';

/** Energies from precomputed electronic matrix elements (normalized basis) and the nuclear repulsion. */
export function lcaoEnergiesFromMatrixElements(
  elements: LcaoMatrixElements & { normA?: number; normB?: number },
  nuclearRepulsionHartree: number,
): LcaoEnergies {
  const { overlap, haa, hbb, hab } = elements;
  const { lower, upper } = generalizedEigenTwoByTwo(
    { aa: haa, bb: hbb, ab: hab },
    { aa: elements.normA ?? 1, bb: elements.normB ?? 1, ab: overlap },
  );
  return {
    bondingHartree: lower.energyHartree + nuclearRepulsionHartree,
    antibondingHartree: upper.energyHartree + nuclearRepulsionHartree,
    bondingElectronicHartree: lower.energyHartree,
    antibondingElectronicHartree: upper.energyHartree,
    nuclearRepulsionHartree,
    overlap,
    haa,
    hbb,
    hab,
    bonding: { coefficientA: lower.coefficientA, coefficientB: lower.coefficientB },
    antibonding: { coefficientA: upper.coefficientA, coefficientB: upper.coefficientB },
  };
}

export function lcaoEnergies(input: LcaoInput): LcaoEnergies {
  const elements = lcaoMatrixElements(input);
  return lcaoEnergiesFromMatrixElements(elements, (input.za * input.zb) / input.distanceBohr);
}
