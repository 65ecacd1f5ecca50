/**
 * Atomic orbital energies (eV, negative = bound) for drawing correlation diagrams.
 *
 * Valence levels: valence-orbital ionization energies (configuration-averaged) of
 *   J. B. Mann, T. L. Meek, L. C. Allen, J. Am. Chem. Soc. 122 (2000) 2780, as tabulated in
 *   G. L. Miessler & D. A. Tarr, Inorganic Chemistry, "orbital potential energies" (from memory).
 * Li 2p and Be 2p (empty in the atom's ground configuration) are estimates: first ionization
 *   energy minus the 2s → 2p excitation energy (Li 2p ²P 1.85 eV; Be 2s2p configuration average
 *   of ³P 2.73 eV and ¹P 5.28 eV, weighted 9:3 = 3.37 eV; NIST Atomic Spectra Database, from memory).
 * Core 1s levels: 1s electron binding energies (J. A. Bearden & A. F. Burr, Rev. Mod. Phys. 39
 *   (1967) 125, as in the X-ray Data Booklet; from memory). Only for drawing (with a broken axis).
 * The diagram needs order and rough spacing only; these numbers are not reference results.
 */
export type AtomicOrbitalName = '1s' | '2s' | '2p';

export interface AtomicOrbitalEnergy {
  orbital: AtomicOrbitalName;
  energyEv: number;
  source: string;
}

export const ORBITAL_ENERGY_SOURCES = {
  valence:
    'Mann, Meek & Allen, J. Am. Chem. Soc. 122 (2000) 2780, via Miessler & Tarr, Inorganic Chemistry (from memory)',
  estimate: 'estimate: ionization energy − 2s→2p excitation energy (NIST ASD; from memory)',
  core: '1s binding energy, Bearden & Burr, Rev. Mod. Phys. 39 (1967) 125 / X-ray Data Booklet (from memory)',
} as const;

const V = ORBITAL_ENERGY_SOURCES.valence;
const E = ORBITAL_ENERGY_SOURCES.estimate;
const C = ORBITAL_ENERGY_SOURCES.core;

export const ATOMIC_ORBITAL_ENERGIES: Readonly<Record<string, readonly AtomicOrbitalEnergy[]>> = {
  H: [{ orbital: '1s', energyEv: -13.61, source: V }],
  He: [{ orbital: '1s', energyEv: -24.59, source: V }],
  Li: [
    { orbital: '1s', energyEv: -54.7, source: C },
    { orbital: '2s', energyEv: -5.39, source: V },
    { orbital: '2p', energyEv: -3.54, source: E },
  ],
  Be: [
    { orbital: '1s', energyEv: -111.5, source: C },
    { orbital: '2s', energyEv: -9.32, source: V },
    { orbital: '2p', energyEv: -5.95, source: E },
  ],
  B: [
    { orbital: '1s', energyEv: -188.0, source: C },
    { orbital: '2s', energyEv: -14.05, source: V },
    { orbital: '2p', energyEv: -8.3, source: V },
  ],
  C: [
    { orbital: '1s', energyEv: -284.2, source: C },
    { orbital: '2s', energyEv: -19.43, source: V },
    { orbital: '2p', energyEv: -10.66, source: V },
  ],
  N: [
    { orbital: '1s', energyEv: -409.9, source: C },
    { orbital: '2s', energyEv: -25.56, source: V },
    { orbital: '2p', energyEv: -13.18, source: V },
  ],
  O: [
    { orbital: '1s', energyEv: -543.1, source: C },
    { orbital: '2s', energyEv: -32.38, source: V },
    { orbital: '2p', energyEv: -15.85, source: V },
  ],
  F: [
    { orbital: '1s', energyEv: -696.7, source: C },
    { orbital: '2s', energyEv: -40.17, source: V },
    { orbital: '2p', energyEv: -18.65, source: V },
  ],
  Ne: [
    { orbital: '1s', energyEv: -870.2, source: C },
    { orbital: '2s', energyEv: -48.47, source: V },
    { orbital: '2p', energyEv: -21.59, source: V },
  ],
};

/** Energy (eV) of one atomic orbital; RangeError if the element or orbital is not tabulated. */
export function atomicOrbitalEnergyEv(element: string, orbital: AtomicOrbitalName): number {
  const entry = ATOMIC_ORBITAL_ENERGIES[element]?.find((o) => o.orbital === orbital);
  if (!entry) throw new RangeError(`no orbital energy for ${element} ${orbital}`);
  return entry.energyEv;
}
