/**
 * Harmonic vibrational wavenumber ωe = (1/2πc)·√(k/μ) of a diatomic, with
 * k = d²E/dR² at Re (harmonic oscillator; Herzberg, Spectra of Diatomic
 * Molecules, 2nd ed., 1950, ch. III §1). In atomic units √(k/μ) is an angular
 * frequency in Eh/ħ, i.e. ħω in hartree, so ωe in cm⁻¹ is √(k/μ) times the
 * CODATA 2018 factor HARTREE_WAVENUMBER (1 Eh = 219474.63 cm⁻¹ · hc).
 */
import { HARTREE_WAVENUMBER } from '../units';

export interface HarmonicWavenumberInput {
  curvatureHartreePerBohr2: number;
  reducedMassMe: number;
}

export function harmonicWavenumber({ curvatureHartreePerBohr2, reducedMassMe }: HarmonicWavenumberInput): number {
  if (!(curvatureHartreePerBohr2 > 0) || !Number.isFinite(curvatureHartreePerBohr2)) {
    throw new RangeError(`Harmonic wavenumber needs a positive finite curvature (got ${curvatureHartreePerBohr2} Eh/a0²).`);
  }
  if (!(reducedMassMe > 0) || !Number.isFinite(reducedMassMe)) {
    throw new RangeError(`Harmonic wavenumber needs a positive finite reduced mass (got ${reducedMassMe} me).`);
  }
  return Math.sqrt(curvatureHartreePerBohr2 / reducedMassMe) * HARTREE_WAVENUMBER;
}
