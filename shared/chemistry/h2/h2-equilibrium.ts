/**
 * Equilibrium distance Re, energy E(Re) and dissociation energy
 * De = E(two H atoms, same basis) − E(Re) of the H2 ground state in one
 * model, at fixed ζ or with ζ optimized at every R. Brent minimization over
 * R (numeric/minimize.ts) in [0.6, 4] bohr — one minimum there for all three
 * models — nested with h2OptimizedZeta for 'opt'.
 * This is the model's own exact minimum, not a fit to grid points
 * (fitting student curves is the marking code's business).
 */
import { minimizeBrent } from '../numeric';
import type { H2Method } from './types';
import { h2Energy } from './h2-energy';
import { h2OptimizedZeta } from './h2-optimized-zeta';
import { h2DissociationLimit } from './h2-dissociation-limit';

export interface H2EquilibriumInput {
  method: H2Method;
  zeta: number | 'opt';
}

export interface H2Equilibrium {
  distanceBohr: number;
  /** ζ at Re (the fixed one, or the optimum there) */
  zeta: number;
  totalHartree: number;
  /** De against two H atoms in the same basis, hartree (positive when bound) */
  dissociationEnergyHartree: number;
}

const DISTANCE_BRACKET_BOHR: [number, number] = [0.6, 4];
const DISTANCE_TOLERANCE_BOHR = 1e-9;

export function h2Equilibrium({ method, zeta }: H2EquilibriumInput): H2Equilibrium {
  let warmZeta: number | undefined;
  const energyAt = (distanceBohr: number): number => {
    if (zeta !== 'opt') return h2Energy({ method, zeta, distanceBohr }).totalHartree;
    const best = h2OptimizedZeta({ method, distanceBohr, zetaGuess: warmZeta });
    warmZeta = best.zeta;
    return best.totalHartree;
  };
  const [low, high] = DISTANCE_BRACKET_BOHR;
  const minimum = minimizeBrent(energyAt, low, high, DISTANCE_TOLERANCE_BOHR);
  const distanceBohr = minimum.x;
  const atR = zeta === 'opt' ? h2OptimizedZeta({ method, distanceBohr, zetaGuess: warmZeta }) : { zeta, ...h2Energy({ method, zeta, distanceBohr }) };
  const { separatedAtomsHartree } = h2DissociationLimit({ method, zeta });
  return {
    distanceBohr,
    zeta: atR.zeta,
    totalHartree: atR.totalHartree,
    dissociationEnergyHartree: separatedAtomsHartree - atR.totalHartree,
  };
}
