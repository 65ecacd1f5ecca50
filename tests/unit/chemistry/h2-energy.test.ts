import { describe, expect, it } from 'vitest';
import {
  h2Curve,
  h2DissociationLimit,
  h2Energy,
  h2Equilibrium,
  h2Methods,
  h2OptimizedZeta,
} from '@shared/chemistry/h2';
import { h2OneElectronIntegrals } from '@shared/chemistry/h2/one-electron-integrals';
import { twoElectronIntegrals } from '@shared/chemistry/h2/two-electron-integrals';
import { molecularOrbitalIntegrals } from '@shared/chemistry/h2/molecular-orbital-integrals';
import { configurationInteractionElectronicEnergy } from '@shared/chemistry/h2/configuration-interaction-energy';
import { valenceBondElectronicEnergy } from '@shared/chemistry/h2/valence-bond-energy';
import { HARTREE_EV } from '@shared/chemistry/units';

const toEv = (hartree: number) => hartree * HARTREE_EV;
const grid = (from: number, to: number, count: number) =>
  Array.from({ length: count }, (_, i) => from + (i * (to - from)) / (count - 1));

describe('H2 equilibrium, fixed ζ = 1', () => {
  it('simple MO: Re = 1.603 bohr, De = 2.70 eV', () => {
    const { distanceBohr, dissociationEnergyHartree, totalHartree } = h2Equilibrium({ method: 'mo', zeta: 1 });
    expect(distanceBohr).toBeCloseTo(1.603, 3); // science.md §3: Levine, Quantum Chemistry, ch. 13 (from memory)
    expect(toEv(dissociationEnergyHartree)).toBeCloseTo(2.7, 2); // science.md §3: Levine, ch. 13 (from memory)
    expect(totalHartree).toBeCloseTo(-1.0990808, 7); // computed (regression)
  });

  it('valence bond (Heitler–London): Re = 1.643 bohr, De = 3.16 eV', () => {
    const { distanceBohr, dissociationEnergyHartree, totalHartree } = h2Equilibrium({ method: 'vb', zeta: 1 });
    expect(distanceBohr).toBeCloseTo(1.643, 3); // science.md §3: Levine, ch. 13 (from memory)
    expect(toEv(dissociationEnergyHartree)).toBeCloseTo(3.16, 2); // science.md §3: Levine, ch. 13 (from memory)
    expect(totalHartree).toBeCloseTo(-1.1159705, 7); // computed (regression)
  });

  it('MO with configuration interaction lies between VB and the exact curve', () => {
    const ci = h2Equilibrium({ method: 'ci', zeta: 1 });
    expect(ci.distanceBohr).toBeCloseTo(1.668, 3); // computed (regression)
    expect(toEv(ci.dissociationEnergyHartree)).toBeCloseTo(3.2286, 3); // computed (regression)
    const vb = h2Equilibrium({ method: 'vb', zeta: 1 });
    expect(ci.totalHartree).toBeLessThan(vb.totalHartree);
  });
});

describe('H2 equilibrium, ζ optimized at every R', () => {
  it('simple MO (Coulson 1938): Re ≈ 1.38 bohr, ζ ≈ 1.197, De ≈ 3.49 eV', () => {
    const { distanceBohr, zeta, dissociationEnergyHartree } = h2Equilibrium({ method: 'mo', zeta: 'opt' });
    expect(Math.abs(distanceBohr - 1.38)).toBeLessThan(0.01); // Coulson, Proc. Camb. Phil. Soc. 34 (1938) 204, via Levine (from memory)
    expect(Math.abs(zeta - 1.197)).toBeLessThan(0.01); // Coulson 1938 (from memory); we find 1.193
    expect(Math.abs(toEv(dissociationEnergyHartree) - 3.49)).toBeLessThan(0.02); // Coulson 1938 (from memory)
  });

  it('valence bond (Wang 1928): Re ≈ 1.406 bohr, ζ ≈ 1.166, De ≈ 3.78 eV', () => {
    const { distanceBohr, zeta, dissociationEnergyHartree } = h2Equilibrium({ method: 'vb', zeta: 'opt' });
    expect(Math.abs(distanceBohr - 1.406)).toBeLessThan(0.01); // Wang, Phys. Rev. 31 (1928) 579, via Levine (from memory); we find 1.414
    expect(Math.abs(zeta - 1.166)).toBeLessThan(0.01); // Wang 1928 (from memory)
    expect(Math.abs(toEv(dissociationEnergyHartree) - 3.78)).toBeLessThan(0.02); // Wang 1928 (from memory)
  });

  it('MO with configuration interaction', () => {
    const { distanceBohr, zeta, totalHartree } = h2Equilibrium({ method: 'ci', zeta: 'opt' });
    expect(distanceBohr).toBeCloseTo(1.4304, 3); // computed (regression)
    expect(zeta).toBeCloseTo(1.1938, 3); // computed (regression)
    expect(totalHartree).toBeCloseTo(-1.1479371, 6); // computed (regression)
  });

  it('no model goes below the exact Born–Oppenheimer minimum (variational principle)', () => {
    for (const method of h2Methods) {
      // exact E(Re) = −1.1744757 Eh at Re = 1.4011 bohr (Kołos & Wolniewicz; from memory)
      expect(h2Equilibrium({ method, zeta: 'opt' }).totalHartree).toBeGreaterThan(-1.1744757);
    }
  });
});

describe('H2 energy: ordering of the models', () => {
  const distances = grid(0.3, 20, 120);
  it('CI ≤ MO and CI ≤ VB at every R (the CI space contains both functions)', () => {
    for (const zeta of [0.9, 1, 1.2]) {
      for (const distanceBohr of distances) {
        const ci = h2Energy({ method: 'ci', zeta, distanceBohr }).totalHartree;
        expect(ci).toBeLessThanOrEqual(h2Energy({ method: 'mo', zeta, distanceBohr }).totalHartree + 1e-14);
        expect(ci).toBeLessThanOrEqual(h2Energy({ method: 'vb', zeta, distanceBohr }).totalHartree + 1e-14);
      }
    }
  });

  it('ζ-optimized energy ≤ fixed-ζ energy at every R', () => {
    for (const method of h2Methods) {
      const optimized = h2Curve({ method, zeta: 'opt', distancesBohr: distances });
      for (const zeta of [0.8, 1, 1.2, 1.5]) {
        const fixed = h2Curve({ method, zeta, distancesBohr: distances });
        optimized.forEach((point, i) => expect(point.totalHartree).toBeLessThanOrEqual(fixed[i].totalHartree + 1e-12));
      }
    }
  });

  it('total = electronic + 1/R', () => {
    const { totalHartree, electronicHartree } = h2Energy({ method: 'vb', zeta: 1.1, distanceBohr: 1.7 });
    expect(totalHartree - electronicHartree).toBeCloseTo(1 / 1.7, 15);
  });
});

describe('H2 energy at the ends of the curve', () => {
  it('CI and VB dissociate to two H atoms, −1 Eh at ζ = 1', () => {
    for (const method of ['ci', 'vb'] as const) {
      expect(Math.abs(h2Energy({ method, zeta: 1, distanceBohr: 20 }).totalHartree + 1)).toBeLessThan(1e-6);
      expect(Math.abs(h2Energy({ method, zeta: 1, distanceBohr: 200 }).totalHartree + 1)).toBeLessThan(1e-13);
    }
  });

  it('simple MO stays above −1 Eh at large R and tends to −1 + 5/16 − 1/(2R) (half ionic)', () => {
    for (const distanceBohr of grid(4, 40, 37)) {
      expect(h2Energy({ method: 'mo', zeta: 1, distanceBohr }).totalHartree).toBeGreaterThan(-1);
    }
    // derived here from science.md §3: (aa|bb) → 1/R, S, Hab, (aa|ab), (ab|ab) → 0
    const distanceBohr = 1000;
    const energy = h2Energy({ method: 'mo', zeta: 1, distanceBohr }).totalHartree;
    expect(energy + 1 / (2 * distanceBohr)).toBeCloseTo(-0.6875, 12);
  });

  it('CI mixes σg² and σu² equally at large R (covalent function) and hardly at all near Re', () => {
    const mixing = (distanceBohr: number) =>
      configurationInteractionElectronicEnergy(
        molecularOrbitalIntegrals(
          h2OneElectronIntegrals({ zeta: 1, distanceBohr }),
          twoElectronIntegrals({ zeta: 1, distanceBohr }),
        ),
      );
    const far = mixing(30);
    expect(far.sigmaGSquared).toBeCloseTo(Math.SQRT1_2, 8);
    expect(far.sigmaUSquared).toBeCloseTo(-Math.SQRT1_2, 8);
    const near = mixing(1.668);
    expect(near.sigmaGSquared).toBeGreaterThan(0.99);
    expect(near.sigmaUSquared).toBeLessThan(0);
  });

  it('MO and VB tend to the He-atom 1s² energy ζ² − 4ζ + 5ζ/8 as R → 0 (−2.84765625 at ζ = 27/16)', () => {
    const zeta = 27 / 16;
    for (const method of ['mo', 'vb'] as const) {
      const { electronicHartree } = h2Energy({ method, zeta, distanceBohr: 1e-4 });
      // He, screened 1s², ζ = 27/16: E = −(27/16)² (Kellner, Z. Phys. 44 (1927) 91; from memory)
      expect(electronicHartree).toBeCloseTo(-2.84765625, 7);
    }
  });

  it('is continuous in R, also where the exchange integral changes form (w = 1)', () => {
    for (const method of h2Methods) {
      const delta = 1e-5;
      const [left, centre, right] = [1 - delta, 1, 1 + delta].map(
        (distanceBohr) => h2Energy({ method, zeta: 1, distanceBohr }).totalHartree,
      );
      // second difference ≈ E''·δ², with |E''| of order 1 Eh/bohr² here; a jump of 1e−12 would show
      expect(Math.abs(left - 2 * centre + right)).toBeLessThan(1e-9);
      const curve = h2Curve({ method, zeta: 1, distancesBohr: grid(0.3, 10, 400) });
      for (let i = 1; i < curve.length; i++) {
        const step = curve[i].distanceBohr - curve[i - 1].distanceBohr;
        // steepest slope on the grid is that of the 1/R wall at 0.3 bohr, about 11 Eh/bohr
        expect(Math.abs(curve[i].totalHartree - curve[i - 1].totalHartree)).toBeLessThan(12 * step);
      }
    }
  });
});

describe('H2 triplet ³Σu⁺ (σgσu)', () => {
  const distances = grid(0.5, 12, 60);
  it('is the same state in MO, CI and VB and equals the Heitler–London triplet (Q − K)/(1 − S²)', () => {
    for (const distanceBohr of distances) {
      const energies = h2Methods.map(
        (method) => h2Energy({ method, zeta: 1.05, distanceBohr, state: 'triplet' }).electronicHartree,
      );
      const heitlerLondon = valenceBondElectronicEnergy(
        h2OneElectronIntegrals({ zeta: 1.05, distanceBohr }),
        twoElectronIntegrals({ zeta: 1.05, distanceBohr }),
        'triplet',
      );
      for (const energy of energies) expect(Math.abs(energy - heitlerLondon)).toBeLessThan(1e-12);
    }
  });

  it('is repulsive: falls monotonically towards −1 Eh and lies above the CI and VB ground states', () => {
    const triplet = h2Curve({ method: 'mo', zeta: 1, distancesBohr: distances, state: 'triplet' });
    for (let i = 1; i < triplet.length; i++) expect(triplet[i].totalHartree).toBeLessThan(triplet[i - 1].totalHartree);
    for (const point of triplet) expect(point.totalHartree).toBeGreaterThan(-1);
    expect(Math.abs(triplet[triplet.length - 1].totalHartree + 1)).toBeLessThan(1e-5);
    for (const method of ['ci', 'vb'] as const) {
      const ground = h2Curve({ method, zeta: 1, distancesBohr: distances });
      ground.forEach((point, i) => expect(point.totalHartree).toBeLessThan(triplet[i].totalHartree));
    }
  });

  it('crosses the simple MO ground state at long range (the MO failure to dissociate)', () => {
    const below = distances.filter((distanceBohr) => distanceBohr <= 2.5);
    const above = distances.filter((distanceBohr) => distanceBohr >= 6);
    for (const distanceBohr of below) {
      expect(h2Energy({ method: 'mo', zeta: 1, distanceBohr }).totalHartree).toBeLessThan(
        h2Energy({ method: 'mo', zeta: 1, distanceBohr, state: 'triplet' }).totalHartree,
      );
    }
    for (const distanceBohr of above) {
      expect(h2Energy({ method: 'mo', zeta: 1, distanceBohr }).totalHartree).toBeGreaterThan(
        h2Energy({ method: 'mo', zeta: 1, distanceBohr, state: 'triplet' }).totalHartree,
      );
    }
  });
});

describe('h2DissociationLimit', () => {
  it('gives two H atoms for VB, CI and the triplet, and the half-ionic limit for MO', () => {
    expect(h2DissociationLimit({ method: 'vb', zeta: 1 })).toEqual({
      methodLimitHartree: -1,
      separatedAtomsHartree: -1,
      dissociatesCorrectly: true,
    });
    expect(h2DissociationLimit({ method: 'ci', zeta: 'opt' }).methodLimitHartree).toBe(-1);
    expect(h2DissociationLimit({ method: 'mo', zeta: 1, state: 'triplet' }).dissociatesCorrectly).toBe(true);
    const mo = h2DissociationLimit({ method: 'mo', zeta: 1 });
    expect(mo.methodLimitHartree).toBe(-0.6875); // −1 + 5/16, derived here (science.md §3 integrals at R → ∞)
    expect(mo.separatedAtomsHartree).toBe(-1);
    expect(mo.dissociatesCorrectly).toBe(false);
    // two atoms in a basis with ζ ≠ 1: 2(ζ²/2 − ζ)
    expect(h2DissociationLimit({ method: 'vb', zeta: 1.2 }).separatedAtomsHartree).toBeCloseTo(1.44 - 2.4, 15);
  });

  it('agrees with the energies themselves at large R', () => {
    for (const zeta of [0.9, 1, 1.2]) {
      for (const method of h2Methods) {
        const { methodLimitHartree } = h2DissociationLimit({ method, zeta });
        const distanceBohr = 1e4;
        // MO keeps a −1/(2R) tail from its ionic half; the others approach exponentially
        const tail = method === 'mo' ? -1 / (2 * distanceBohr) : 0;
        expect(h2Energy({ method, zeta, distanceBohr }).totalHartree).toBeCloseTo(methodLimitHartree + tail, 10);
      }
    }
  });

  it('with ζ optimized, MO tends to −(27/32)² at ζ = 27/32', () => {
    const { zeta, totalHartree } = h2OptimizedZeta({ method: 'mo', distanceBohr: 1e4 });
    expect(zeta).toBeCloseTo(27 / 32, 3); // derived here: minimum of ζ² − 27ζ/16
    expect(totalHartree + 1 / 2e4).toBeCloseTo(h2DissociationLimit({ method: 'mo', zeta: 'opt' }).methodLimitHartree, 7);
  });
});

describe('h2OptimizedZeta and h2Curve', () => {
  it('the warm-started curve finds the same optimum as a cold search at every point', () => {
    const distancesBohr = grid(0.3, 8, 40);
    for (const method of h2Methods) {
      const curve = h2Curve({ method, zeta: 'opt', distancesBohr });
      curve.forEach((point, i) => {
        const cold = h2OptimizedZeta({ method, distanceBohr: distancesBohr[i] });
        expect(Math.abs(point.zeta - cold.zeta)).toBeLessThan(1e-6);
        expect(Math.abs(point.totalHartree - cold.totalHartree)).toBeLessThan(1e-12);
      });
    }
  });

  it('recovers from a bad guess', () => {
    const good = h2OptimizedZeta({ method: 'vb', distanceBohr: 1.4 });
    const fromBadGuess = h2OptimizedZeta({ method: 'vb', distanceBohr: 1.4, zetaGuess: 2.5 });
    expect(fromBadGuess.zeta).toBeCloseTo(good.zeta, 6);
  });

  it('the optimum is a stationary point: dE/dζ = 0 there', () => {
    const { zeta } = h2OptimizedZeta({ method: 'ci', distanceBohr: 1.43 });
    const step = 1e-4;
    const slope =
      (h2Energy({ method: 'ci', zeta: zeta + step, distanceBohr: 1.43 }).totalHartree -
        h2Energy({ method: 'ci', zeta: zeta - step, distanceBohr: 1.43 }).totalHartree) /
      (2 * step);
    expect(Math.abs(slope)).toBeLessThan(1e-7);
  });

  // speed is measured by `npm run bench -- engine`, not here

  it('rejects bad input', () => {
    expect(() => h2Energy({ method: 'mo', zeta: 1, distanceBohr: -1 })).toThrow(RangeError);
    expect(() => h2Energy({ method: 'mo', zeta: 0, distanceBohr: 1 })).toThrow(RangeError);
    expect(() => h2Energy({ method: 'xx' as never, zeta: 1, distanceBohr: 1 })).toThrow(RangeError);
    expect(() => h2DissociationLimit({ method: 'mo', zeta: -2 })).toThrow(RangeError);
  });
});
