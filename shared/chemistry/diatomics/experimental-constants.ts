/**
 * Experimental equilibrium bond lengths and harmonic wavenumbers of ground states, to show
 * beside a diagram. K. P. Huber & G. Herzberg, Molecular Spectra and Molecular Structure IV:
 * Constants of Diatomic Molecules (1979); values recalled from memory (also in the NIST
 * Chemistry WebBook, which reproduces that compilation).
 */
export interface DiatomicConstants {
  formula: string;
  /** equilibrium internuclear distance r_e / Å */
  reAngstrom: number;
  /** harmonic vibrational wavenumber ω_e / cm⁻¹ */
  omegaEWavenumber: number;
  source: string;
}

const HH = 'Huber & Herzberg, Constants of Diatomic Molecules (1979); from memory';

export const EXPERIMENTAL_DIATOMIC_CONSTANTS: readonly DiatomicConstants[] = [
  { formula: 'H2', reAngstrom: 0.7414, omegaEWavenumber: 4401.2, source: HH },
  { formula: 'N2', reAngstrom: 1.0977, omegaEWavenumber: 2358.6, source: HH },
  { formula: 'O2', reAngstrom: 1.2075, omegaEWavenumber: 1580.2, source: HH },
  { formula: 'F2', reAngstrom: 1.4119, omegaEWavenumber: 916.6, source: HH },
  { formula: 'CO', reAngstrom: 1.1283, omegaEWavenumber: 2169.8, source: HH },
  { formula: 'NO', reAngstrom: 1.1508, omegaEWavenumber: 1904.2, source: HH },
  { formula: 'HF', reAngstrom: 0.9168, omegaEWavenumber: 4138.3, source: HH },
];

/** Constants of a neutral species by canonical formula ("O2", "CO"), or null if not tabulated. */
export function experimentalConstants(formula: string): DiatomicConstants | null {
  return EXPERIMENTAL_DIATOMIC_CONSTANTS.find((c) => c.formula === formula) ?? null;
}
