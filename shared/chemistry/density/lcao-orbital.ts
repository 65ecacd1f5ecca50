/**
 * A normalized minimal-LCAO orbital ψ = ca·φa + cb·φb of the one-electron
 * two-centre bond, φ = (ζ³/π)^½ e^(−ζr). Coefficients from the 2×2 problem
 * det(H − E·S) = 0 (homonuclear: ca = ±cb = 1/√(2 ± 2S)), normalized so that
 * ∫ψ² dV = ca² + cb² + 2·ca·cb·S = 1.
 * Source: Pauling & Wilson, Introduction to Quantum Mechanics (1935) ch. XII §42;
 * Finkelstein & Horowitz, Z. Phys. 48 (1928) 118 (optimized ζ).
 */
import { lcaoEnergies, lcaoOptimizedZeta } from '@shared/chemistry/lcao';
import { assertPositive } from '@shared/chemistry/lcao/assert-positive';
import type { LcaoOrbital, OrbitalInput } from './types';

export function lcaoOrbital({ za, zb, zeta, distanceBohr, state }: OrbitalInput): LcaoOrbital {
  if (state !== 'bonding' && state !== 'antibonding') throw new RangeError(`state must be 'bonding' or 'antibonding', got ${state}`);
  const exponent = zeta === 'opt' ? lcaoOptimizedZeta({ za, zb, distanceBohr, state }).zeta : zeta;
  assertPositive('zeta', exponent);
  const energies = lcaoEnergies({ za, zb, zeta: exponent, distanceBohr });
  const { coefficientA, coefficientB } = state === 'bonding' ? energies.bonding : energies.antibonding;
  const norm = Math.sqrt((exponent * exponent * exponent) / Math.PI);
  const half = distanceBohr / 2;
  const valueAt = (axialBohr: number, perpendicularBohr: number): number => {
    const rho2 = perpendicularBohr * perpendicularBohr;
    const ra = Math.sqrt(rho2 + (axialBohr + half) ** 2);
    const rb = Math.sqrt(rho2 + (axialBohr - half) ** 2);
    return norm * (coefficientA * Math.exp(-exponent * ra) + coefficientB * Math.exp(-exponent * rb));
  };
  return {
    zeta: exponent,
    coefficientA,
    coefficientB,
    energyHartree: state === 'bonding' ? energies.bondingHartree : energies.antibondingHartree,
    valueAt,
  };
}
