import { describe, expect, it } from 'vitest';
import {
  ISOTOPES,
  findIsotope,
  harmonicWavenumber,
  isotopeMassMe,
  reducedMassMe,
} from '@shared/chemistry/analysis';
import { DALTON_ME, PROTON_MASS_ME, SPEED_OF_LIGHT_AU } from '@shared/chemistry/units';

const ALPHA_SQUARED = 1 / SPEED_OF_LIGHT_AU ** 2; // α², CODATA 2018

describe('isotope masses', () => {
  it('offers every isotope Bondmark needs, with 12C exactly 12 u', () => {
    expect(Object.keys(ISOTOPES)).toEqual(
      ['1H', '2H', '3H', '4He', '6Li', '7Li', '9Be', '10B', '11B', '12C', '13C', '14N', '15N', '16O', '18O', '19F', '20Ne'],
    );
    expect(ISOTOPES['12C'].atomicMassU).toBe(12); // definition of the unified atomic mass unit
    for (const iso of Object.values(ISOTOPES)) {
      // every atomic mass lies within 0.02 u of its mass number (mass defects of light nuclides)
      expect(Math.abs(iso.atomicMassU - iso.massNumber)).toBeLessThan(0.02);
    }
  });

  it('atomic mass minus electrons agrees with CODATA 2018 nuclear masses to within the electron binding energy', () => {
    // m(atom) = m(nucleus) + Z·me − B/c², with B/c² in me = α²·(binding energy in Eh)
    // 1H: B = 1/2 Eh (hydrogen 1s, textbook); proton mass CODATA 2018 (units module)
    const proton = ISOTOPES['1H'].atomicMassU * DALTON_ME - 1;
    expect(Math.abs(proton - (PROTON_MASS_ME - 0.5 * ALPHA_SQUARED))).toBeLessThan(1e-6);
    // 2H: deuteron mass 3670.48296788 me (CODATA 2018, from memory), B = 1/2 Eh
    const deuteron = isotopeMassMe('2H', 'nuclear');
    expect(Math.abs(deuteron - (3670.48296788 - 0.5 * ALPHA_SQUARED))).toBeLessThan(1e-6);
    // 4He: alpha-particle mass 7294.29954142 me (CODATA 2018, from memory); B = 2.903724 Eh
    // (helium ground state, Pekeris 1959 / Drake; from memory)
    const alpha = isotopeMassMe('4He', 'nuclear');
    expect(Math.abs(alpha - (7294.29954142 - 2.903724 * ALPHA_SQUARED))).toBeLessThan(1e-6);
  });

  it('uses the CODATA proton mass for a bare 1H nucleus', () => {
    expect(isotopeMassMe('1H', 'nuclear')).toBe(PROTON_MASS_ME);
    expect(isotopeMassMe('1H')).toBeCloseTo(1.00782503223 * 1822.888486209, 9); // NIST/AME2016 (from memory) × CODATA 2018 u
  });

  it('knows D and T as aliases and rejects unknown isotopes', () => {
    expect(findIsotope('D')).toBe(ISOTOPES['2H']);
    expect(findIsotope('T')).toBe(ISOTOPES['3H']);
    expect(() => findIsotope('17O')).toThrow(/Unknown isotope "17O"/);
    expect(() => findIsotope('toString')).toThrow(RangeError);
  });
});

describe('reducedMassMe', () => {
  it('is half the atomic mass for a homonuclear pair, and half the proton mass for bare protons', () => {
    expect(reducedMassMe(['1H', '1H'])).toBeCloseTo((1.00782503223 * DALTON_ME) / 2, 9);
    expect(reducedMassMe(['1H', '1H'], { masses: 'nuclear' })).toBeCloseTo(PROTON_MASS_ME / 2, 10);
  });

  it('m1·m2/(m1 + m2) for a heteronuclear pair, symmetric in its arguments', () => {
    const m1 = 12 * DALTON_ME;
    const m2 = 15.99491461957 * DALTON_ME; // 16O, NIST/AME2016 (from memory)
    expect(reducedMassMe(['12C', '16O'])).toBeCloseTo((m1 * m2) / (m1 + m2), 8);
    expect(reducedMassMe(['16O', '12C'])).toBe(reducedMassMe(['12C', '16O']));
  });

  it('gives the isotope shift of ωe: ωe(D2)/ωe(H2) = √(μ(H2)/μ(D2)), close to experiment', () => {
    const k = 0.3686; // any curvature, Eh/a0²
    const h2 = harmonicWavenumber({ curvatureHartreePerBohr2: k, reducedMassMe: reducedMassMe(['1H', '1H']) });
    const d2 = harmonicWavenumber({ curvatureHartreePerBohr2: k, reducedMassMe: reducedMassMe(['D', 'D']) });
    expect(d2 / h2).toBeCloseTo(Math.sqrt(1.00782503223 / 2.01410177812), 12); // computed
    // experiment: ωe(D2) = 3115.5, ωe(H2) = 4401.2 cm⁻¹ (Huber & Herzberg 1979, from memory); the harmonic
    // ratio misses it by < 0.1 % (adiabatic and non-adiabatic corrections)
    expect(Math.abs(d2 / h2 - 3115.5 / 4401.2)).toBeLessThan(1e-3);
  });
});
