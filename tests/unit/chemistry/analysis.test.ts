import { describe, expect, it } from 'vitest';
import {
  analyseCurve,
  classifyCurve,
  countNodes,
  dissociationEnergy,
  dissociationEnergyEv,
  estimateAsymptote,
  estimateNoise,
  findMinimum,
  harmonicWavenumber,
  morseEnergy,
  prepareCurve,
  reducedMassMe,
  type CurvePoints,
  type MorseParameters,
} from '@shared/chemistry/analysis';
import { BOHR_ANGSTROM, HARTREE_EV, SPEED_OF_LIGHT_AU } from '@shared/chemistry/units';
import { gaussian, mulberry32 } from '../../support/random';

// H2-like Morse parameters (from memory; used only to build synthetic curves, never as outside check values)
const H2_LIKE: MorseParameters = { deHartree: 0.1745, aPerBohr: 1.0277, reBohr: 1.4011, asymptoteHartree: -1 };


function grid(from: number, to: number, step: number, offset = 0): number[] {
  const out: number[] = [];
  for (let i = 0; from + offset + i * step <= to + 1e-12; i++) out.push(from + offset + i * step);
  return out;
}

function curveOf(distances: number[], f: (r: number) => number): CurvePoints {
  return { distanceBohr: distances, energyHartree: distances.map(f) };
}

/** uneven grid (steps 0.03–0.12 a0), Gaussian noise σ, three missing points, shuffled */
function messyMorseCurve(seed: number, sigma: number, p: MorseParameters, toBohr = 12): CurvePoints {
  const random = mulberry32(seed);
  const distances: (number | null)[] = [];
  for (let r = 0.8; r <= toBohr; r += 0.03 + 0.09 * random()) distances.push(r);
  const energies: (number | null)[] = distances.map((r) => morseEnergy(r as number, p) + sigma * gaussian(random));
  distances[7] = Number.NaN; // missing distance
  energies[40] = Number.NaN; // missing energy
  energies[90] = null; // empty cell
  for (let i = distances.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [distances[i], distances[j]] = [distances[j], distances[i]];
    [energies[i], energies[j]] = [energies[j], energies[i]];
  }
  return { distanceBohr: distances, energyHartree: energies };
}

/** ωe of a Morse potential in closed form, a·√(2De/μ)/(2πc), with c and a0 taken apart (CODATA 2018) */
function morseWavenumberCm1(p: MorseParameters, muMe: number): number {
  const omegaAtomic = p.aPerBohr * Math.sqrt((2 * p.deHartree) / muMe); // angular frequency, Eh/ħ
  const wavenumberPerBohr = omegaAtomic / (2 * Math.PI * SPEED_OF_LIGHT_AU);
  return wavenumberPerBohr / (BOHR_ANGSTROM * 1e-8); // 1 a0 = BOHR_ANGSTROM·1e−8 cm
}

describe('prepareCurve', () => {
  it('skips missing points, sorts by distance and merges repeated distances', () => {
    const curve = prepareCurve({
      distanceBohr: [3, 1, Number.NaN, 2, 2, null, 4, -1],
      energyHartree: [0.3, 0.1, 9, 0.2, 0.4, 9, Number.POSITIVE_INFINITY, 9],
    });
    expect(Array.from(curve.distanceBohr)).toEqual([1, 2, 3]);
    expect(Array.from(curve.energyHartree)).toEqual([0.1, (0.2 + 0.4) / 2, 0.3]);
    expect(curve.pointsSkipped).toBe(4); // NaN distance, null distance, infinite energy, negative distance
    expect(curve.duplicatesMerged).toBe(1);
  });

  it('rejects arrays of different length', () => {
    expect(() => prepareCurve({ distanceBohr: [1, 2], energyHartree: [1] })).toThrow(RangeError);
  });
});

describe('fewer than 5 usable points', () => {
  const short = { distanceBohr: [1, 2, 3, 4, Number.NaN, 6], energyHartree: [0.5, 0.1, 0.2, 0.3, 0.4, null] };
  it.each([
    ['findMinimum', () => findMinimum(short)],
    ['classifyCurve', () => classifyCurve(short)],
    ['estimateAsymptote', () => estimateAsymptote(short)],
    ['analyseCurve', () => analyseCurve(short)],
  ])('%s throws a RangeError naming the usable and needed counts', (_name, run) => {
    expect(run).toThrow(RangeError);
    expect(run).toThrow(/4 usable points.*at least 5/);
  });
});

describe('findMinimum on exact curves', () => {
  it('recovers the vertex of an exact parabola to machine precision on an uneven grid', () => {
    const distances = [0.9, 1.05, 1.3, 1.42, 1.61, 1.66, 1.9, 2.3, 2.35, 2.8, 3.1];
    const curve = curveOf(distances, (r) => 0.3 * (r - 1.7) ** 2 - 1.1);
    const m = findMinimum(curve)!;
    expect(Math.abs(m.reBohr - 1.7)).toBeLessThan(1e-12); // exact by construction
    expect(Math.abs(m.energyHartree + 1.1)).toBeLessThan(1e-14); // exact by construction
    expect(Math.abs(m.curvatureHartreePerBohr2 - 0.6)).toBeLessThan(1e-10); // 2 × 0.3, exact by construction
  });

  it('recovers the minimum of an exact quartic to machine precision', () => {
    // E = −0.8 + 0.2u² − 0.1u³ + 0.05u⁴, u = R − 2.2: E′ = u(0.4 − 0.3u + 0.2u²) vanishes only at u = 0
    const quartic = (r: number) => {
      const u = r - 2.2;
      return -0.8 + 0.2 * u * u - 0.1 * u ** 3 + 0.05 * u ** 4;
    };
    const curve = curveOf(grid(1.0, 3.6, 0.07, 0.013), quartic);
    const m = findMinimum(curve)!;
    expect(Math.abs(m.reBohr - 2.2)).toBeLessThan(1e-10); // exact by construction
    expect(Math.abs(m.energyHartree + 0.8)).toBeLessThan(1e-14);
    expect(Math.abs(m.curvatureHartreePerBohr2 - 0.4)).toBeLessThan(1e-9); // 2 × 0.2
  });

  it('does not return the lowest grid point: Re and E(Re) of an exact Morse curve on a 0.05 a0 grid', () => {
    // required accuracy: Re within 1e−4 a0, E(Re) within 1e−7 Eh, for every placement of the grid
    for (const offset of [0, 0.0123, 0.025, 0.0377, 0.049]) {
      const curve = curveOf(grid(0.6, 10, 0.05, offset), (r) => morseEnergy(r, H2_LIKE));
      const m = findMinimum(curve)!;
      expect(Math.abs(m.reBohr - H2_LIKE.reBohr)).toBeLessThan(1e-4);
      expect(Math.abs(m.energyHartree - (H2_LIKE.asymptoteHartree - H2_LIKE.deHartree))).toBeLessThan(1e-7);
      // Morse curvature at Re is 2De·a² (closed form); quartic truncation error measured ≤ 2.3e−4 relative
      expect(Math.abs(m.curvatureHartreePerBohr2 / (2 * H2_LIKE.deHartree * H2_LIKE.aPerBohr ** 2) - 1)).toBeLessThan(5e-4);
      expect(m.method).toBe('local-quartic-least-squares');
    }
  });

  it('returns null when the lowest point is at either end of the curve', () => {
    const falling = curveOf(grid(1, 5, 0.1), (r) => 2 * Math.exp(-1.5 * r));
    const rising = curveOf(grid(1, 5, 0.1), (r) => 0.1 * r * r);
    expect(findMinimum(falling)).toBeNull();
    expect(findMinimum(rising)).toBeNull();
  });
});

describe('noisy, unsorted, uneven Morse curves with missing points', () => {
  // Tolerances scale with σ: Re 5e−4 a0 + 70 a0/Eh·σ, E(Re) 1e−7 Eh + 6σ, ωe 1 % + 300 σ/Eh (relative).
  // They sit above the largest errors of findMinimum seen over 1000 seeded trials of this kind of curve
  // (largest: σ = 1e−5: Re 1.0e−3 a0, E 4.7e−5 Eh, k 1.9 %; σ = 1e−4: 5.6e−3, 4.2e−4, 5.6 %; σ = 1e−3:
  // 3.7e−2, 2.4e−3, 12 %) — common practice: tolerances from the measured error distribution.
  const mu = reducedMassMe(['1H', '1H']);
  const exactOmega = morseWavenumberCm1(H2_LIKE, mu);
  const minimumEnergy = H2_LIKE.asymptoteHartree - H2_LIKE.deHartree;
  for (const sigma of [1e-5, 1e-4, 1e-3]) {
    for (const seed of [1, 2, 3, 4, 5]) {
      it(`σ = ${sigma} Eh, seed ${seed}: Re, E(Re), De and ωe within tolerance`, () => {
        const points = messyMorseCurve(seed, sigma, H2_LIKE);
        const analysis = analyseCurve(points, { reducedMassMe: mu });
        expect(analysis.kind).toBe('bound');
        expect(analysis.pointsSkipped).toBe(3);
        expect(analysis.warnings.some((w) => w.startsWith('3 points skipped'))).toBe(true);
        expect(Math.abs(analysis.reBohr! - H2_LIKE.reBohr)).toBeLessThan(5e-4 + 70 * sigma);
        expect(Math.abs(analysis.energyAtMinimumHartree! - minimumEnergy)).toBeLessThan(1e-7 + 6 * sigma);
        // De from the tail: E(Re) error + error of the tail mean (σ/√m) + what the tail still lacks,
        // 2De·e^(−a(R_tail − Re)) (closed form of the Morse tail, computed)
        const asymptote = analysis.asymptote!;
        expect(analysis.limitSource).toBe('tail');
        expect(asymptote.flattened).toBe(true);
        const tailShortfall = 2 * H2_LIKE.deHartree * Math.exp(-H2_LIKE.aPerBohr * (asymptote.tailBohr[0] - H2_LIKE.reBohr));
        const deTolerance = 6 * sigma + (3 * sigma) / Math.sqrt(asymptote.pointsUsed) + tailShortfall;
        expect(Math.abs(analysis.deHartree! - H2_LIKE.deHartree)).toBeLessThan(deTolerance);
        expect(Math.abs(analysis.harmonicWavenumberCm1! / exactOmega - 1)).toBeLessThan(0.01 + 300 * sigma);
        // noise estimate within a factor 2 of the true σ (measured spread 0.6–1.6 × σ)
        expect(analysis.noiseHartree).toBeGreaterThan(sigma / 2);
        expect(analysis.noiseHartree).toBeLessThan(2 * sigma);
      });
    }
  }

  it('exact model data with the model limit: De = limit − E(Re) to 1e−7 Eh', () => {
    const curve = curveOf(grid(0.6, 8, 0.05, 0.021), (r) => morseEnergy(r, H2_LIKE));
    const analysis = analyseCurve(curve, { limitHartree: H2_LIKE.asymptoteHartree, reducedMassMe: mu });
    expect(analysis.limitSource).toBe('given');
    expect(Math.abs(analysis.deHartree! - H2_LIKE.deHartree)).toBeLessThan(1e-7);
    expect(Math.abs(analysis.deEv! - H2_LIKE.deHartree * HARTREE_EV)).toBeLessThan(1e-7 * HARTREE_EV);
    // ωe ∝ √k, curvature within 5e−4 relative, so ωe within 2.5e−4
    expect(Math.abs(analysis.harmonicWavenumberCm1! / exactOmega - 1)).toBeLessThan(2.5e-4);
    expect(analysis.warnings).toEqual([]);
  });
});

describe('classifyCurve', () => {
  const repulsive = (r: number) => 3 * Math.exp(-1.8 * r) - 0.5; // A e^(−bR) + const, no minimum

  it('calls an exponential wall repulsive', () => {
    const c = classifyCurve(curveOf(grid(0.5, 8, 0.1), repulsive));
    expect(c.kind).toBe('repulsive');
    expect(c.monotonicDecreasing).toBe(true);
    expect(c.violations).toBe(0);
    expect(c.minimum).toBeNull();
  });

  it('keeps a noisy repulsive curve repulsive (noise-only wobble on the flat tail)', () => {
    for (const seed of [11, 12, 13, 14, 15, 16, 17, 18]) {
      const random = mulberry32(seed);
      const distances = grid(0.5, 10, 0.05);
      const c = classifyCurve({ distanceBohr: distances, energyHartree: distances.map((r) => repulsive(r) + 1e-4 * gaussian(random)) });
      expect(c.kind, c.message).toBe('repulsive');
    }
  });

  it('calls a shallow well bound when it is deeper than the noise, and repulsive when it is not', () => {
    // wall plus a Morse well of depth De on top of it
    const wellCurve = (de: number, sigma: number, seed: number) => {
      const random = mulberry32(seed);
      const distances = grid(1.5, 12, 0.05);
      const p: MorseParameters = { deHartree: de, aPerBohr: 0.8, reBohr: 5, asymptoteHartree: 0 };
      return { distanceBohr: distances, energyHartree: distances.map((r) => morseEnergy(r, p) + sigma * gaussian(random)) };
    };
    const deep = classifyCurve(wellCurve(2e-3, 2e-5, 21)); // well 100σ deep
    expect(deep.kind).toBe('bound');
    expect(Math.abs(deep.minimum!.reBohr - 5)).toBeLessThan(0.05);
    const lost = classifyCurve(wellCurve(1e-5, 2e-5, 22)); // well half of σ deep: not distinguishable from noise
    expect(lost.kind).not.toBe('bound');
  });

  it('calls a curve that rises from its first point unclear', () => {
    const c = classifyCurve(curveOf(grid(1, 5, 0.1), (r) => 0.1 * r * r));
    expect(c.kind).toBe('unclear');
    expect(c.monotonicDecreasing).toBe(false);
    expect(c.violations).toBeGreaterThan(30);
    expect(c.message).toMatch(/lowest at the shortest distance/);
  });
});

describe('estimateAsymptote', () => {
  it('takes the tail mean of a flattened curve', () => {
    const a = estimateAsymptote(curveOf(grid(0.6, 14, 0.1), (r) => morseEnergy(r, H2_LIKE)));
    expect(a.flattened).toBe(true);
    // remaining tail shortfall 2De·e^(−a(R−Re)) at R ≈ 13 a0 is 2e−6 Eh (closed form, computed)
    expect(Math.abs(a.limitHartree - H2_LIKE.asymptoteHartree)).toBeLessThan(5e-6);
    expect(a.pointsUsed).toBe(10);
  });

  it('flags a curve cut off before it has flattened', () => {
    const a = estimateAsymptote(curveOf(grid(0.6, 4, 0.05), (r) => morseEnergy(r, H2_LIKE)));
    expect(a.flattened).toBe(false);
    expect(a.tailChangeHartree).toBeGreaterThan(1e-3);
    expect(a.limitHartree).toBeLessThan(H2_LIKE.asymptoteHartree - 0.01);
  });

  it('analyseCurve warns that De from an unflattened tail is too small', () => {
    const analysis = analyseCurve(curveOf(grid(0.6, 4, 0.05), (r) => morseEnergy(r, H2_LIKE)));
    expect(analysis.kind).toBe('bound');
    expect(analysis.deHartree!).toBeLessThan(H2_LIKE.deHartree);
    expect(analysis.warnings.some((w) => w.includes('has not flattened'))).toBe(true);
  });
});

describe('dissociation energy and harmonic wavenumber', () => {
  it('De = limit − E(Re), in Eh and eV', () => {
    expect(dissociationEnergy(-1.1745, -1)).toBeCloseTo(0.1745, 15);
    expect(dissociationEnergyEv(-1.1, -1)).toBeCloseTo(0.1 * 27.211386245988, 12); // CODATA 2018 Eh in eV
    expect(() => dissociationEnergy(Number.NaN, -1)).toThrow(RangeError);
  });

  it('ωe of a Morse curvature equals a√(2De/μ)/(2πc)', () => {
    const mu = reducedMassMe(['1H', '1H']);
    const k = 2 * H2_LIKE.deHartree * H2_LIKE.aPerBohr ** 2; // Morse curvature at Re (closed form)
    const omega = harmonicWavenumber({ curvatureHartreePerBohr2: k, reducedMassMe: mu });
    expect(Math.abs(omega / morseWavenumberCm1(H2_LIKE, mu) - 1)).toBeLessThan(1e-10);
    // plausibility: the H2-like parameters give ωe ≈ 4397 cm⁻¹ (computed); experimental H2 ωe = 4401.2 cm⁻¹
    // (Huber & Herzberg 1979, from memory)
    expect(Math.abs(omega - 4401.2)).toBeLessThan(0.01 * 4401.2);
    expect(() => harmonicWavenumber({ curvatureHartreePerBohr2: -0.1, reducedMassMe: mu })).toThrow(RangeError);
  });
});

describe('countNodes', () => {
  it('counts sign changes of a sampled sine, ignoring round-off at the nodes', () => {
    const xs = grid(0.01, 3 * Math.PI - 0.01, 0.01);
    expect(countNodes(xs.map(Math.sin), 1e-12)).toBe(2); // nodes at π and 2π
  });

  it('ignores values below the tolerance and non-finite values', () => {
    expect(countNodes([1, 1e-14, -1e-14, 1e-14, 2], 1e-12)).toBe(0);
    expect(countNodes([1, 1e-14, -1e-14, 1e-14, 2], 0)).toBe(2);
    expect(countNodes([1, Number.NaN, -1, 0, -2, 3], 0)).toBe(2);
    // a σu-like orbital along the axis, ψ ∝ e^(−|z−1|) − e^(−|z+1|): one node at the midpoint
    const zs = grid(-5, 5, 0.1);
    expect(countNodes(zs.map((z) => Math.exp(-Math.abs(z - 1)) - Math.exp(-Math.abs(z + 1))), 1e-12)).toBe(1);
    expect(() => countNodes([1, -1], -1)).toThrow(RangeError);
  });
});

describe('estimateNoise', () => {
  it('is tiny for smooth data and near σ for noisy data', () => {
    const distances = grid(0.8, 8, 0.05);
    expect(estimateNoise(curveOf(distances, (r) => morseEnergy(r, H2_LIKE)))).toBeLessThan(1e-7);
    const random = mulberry32(99);
    const noisy = curveOf(distances, (r) => morseEnergy(r, H2_LIKE) + 1e-4 * gaussian(random));
    const sigma = estimateNoise(noisy);
    expect(sigma).toBeGreaterThan(0.6e-4);
    expect(sigma).toBeLessThan(1.6e-4);
  });
});

