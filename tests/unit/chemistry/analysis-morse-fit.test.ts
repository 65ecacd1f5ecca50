import { describe, expect, it } from 'vitest';
import { fitMorse, morseEnergy, type MorseParameters } from '@shared/chemistry/analysis';
import { gaussian, mulberry32 } from '../../support/random';

// H2-like Morse parameters (from memory; only used to build synthetic curves)
const H2_LIKE: MorseParameters = { deHartree: 0.1745, aPerBohr: 1.0277, reBohr: 1.4011, asymptoteHartree: -1 };


function unevenMorse(seed: number, sigma: number, p: MorseParameters) {
  const random = mulberry32(seed);
  const distanceBohr: number[] = [];
  for (let r = 0.8; r <= 12; r += 0.03 + 0.09 * random()) distanceBohr.push(r);
  const energyHartree: (number | null)[] = distanceBohr.map((r) => morseEnergy(r, p) + sigma * gaussian(random));
  energyHartree[5] = Number.NaN;
  energyHartree[60] = null;
  distanceBohr.reverse(); // unsorted input
  energyHartree.reverse();
  return { distanceBohr, energyHartree };
}

describe('fitMorse', () => {
  it('recovers the parameters of exact Morse data', () => {
    const fit = fitMorse(unevenMorse(1, 0, H2_LIKE));
    expect(fit.converged).toBe(true);
    expect(fit.pointsSkipped).toBe(2);
    expect(Math.abs(fit.deHartree - H2_LIKE.deHartree)).toBeLessThan(1e-9);
    expect(Math.abs(fit.aPerBohr - H2_LIKE.aPerBohr)).toBeLessThan(1e-8);
    expect(Math.abs(fit.reBohr - H2_LIKE.reBohr)).toBeLessThan(1e-8);
    expect(Math.abs(fit.asymptoteHartree - H2_LIKE.asymptoteHartree)).toBeLessThan(1e-9);
    expect(fit.rmsResidualHartree).toBeLessThan(1e-10);
  });

  // Largest errors over 300 seeded trials at σ = 1e−4 Eh (they scale with σ): De 1.2σ, a 8.7σ/Eh·a0⁻¹,
  // Re 5.1σ a0/Eh, E∞ 0.3σ, rms residual within 18 % of σ. Tolerances below sit above those.
  for (const seed of [3, 4, 5]) {
    it(`fits noisy data (σ = 1e−4 Eh, seed ${seed}) within tolerances that scale with σ`, () => {
      const sigma = 1e-4;
      const fit = fitMorse(unevenMorse(seed, sigma, H2_LIKE));
      expect(fit.converged).toBe(true);
      expect(Math.abs(fit.deHartree - H2_LIKE.deHartree)).toBeLessThan(2 * sigma);
      expect(Math.abs(fit.aPerBohr - H2_LIKE.aPerBohr)).toBeLessThan(12 * sigma);
      expect(Math.abs(fit.reBohr - H2_LIKE.reBohr)).toBeLessThan(8 * sigma);
      expect(Math.abs(fit.asymptoteHartree - H2_LIKE.asymptoteHartree)).toBeLessThan(0.5 * sigma);
      expect(Math.abs(fit.rmsResidualHartree / sigma - 1)).toBeLessThan(0.25);
    });
  }

  it('converges from a poor starting guess', () => {
    const fit = fitMorse(unevenMorse(7, 0, H2_LIKE), { deHartree: 0.4, aPerBohr: 2, reBohr: 2.2, asymptoteHartree: -0.9 });
    expect(fit.converged).toBe(true);
    expect(Math.abs(fit.reBohr - H2_LIKE.reBohr)).toBeLessThan(1e-8);
    expect(Math.abs(fit.deHartree - H2_LIKE.deHartree)).toBeLessThan(1e-9);
  });

  it('restricts the fit to an energy window above the minimum', () => {
    const points = unevenMorse(8, 0, H2_LIKE);
    const all = fitMorse(points);
    const low = fitMorse(points, {}, { energyWindowHartree: 0.1 });
    expect(low.pointsUsed).toBeLessThan(all.pointsUsed);
    expect(Math.abs(low.reBohr - H2_LIKE.reBohr)).toBeLessThan(1e-7);
  });

  it('reports a non-Morse curve honestly: converged, but with a visible residual', () => {
    // Lennard-Jones 12-6 well (Jones, Proc. R. Soc. A 106 (1924) 463): ε = 0.01 Eh, minimum at 3 a0
    const distanceBohr = Array.from({ length: 120 }, (_, i) => 2.6 + i * 0.06);
    const energyHartree = distanceBohr.map((r) => 0.01 * ((3 / r) ** 12 - 2 * (3 / r) ** 6));
    const fit = fitMorse({ distanceBohr, energyHartree });
    expect(fit.rmsResidualHartree).toBeGreaterThan(1e-5);
    expect(Math.abs(fit.reBohr - 3)).toBeLessThan(0.05);
  });
});
