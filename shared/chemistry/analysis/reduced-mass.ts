/**
 * Reduced mass of a diatomic, μ = m1·m2/(m1 + m2), in electron masses
 * (two-body reduction, e.g. Herzberg, Spectra of Diatomic Molecules, 2nd ed.,
 * 1950, ch. III). Masses from isotope-masses.ts: atomic masses by default
 * (the usual choice for a neutral molecule, whose electrons move with the
 * nuclei); pass { masses: 'nuclear' } for a one-electron ion such as H2+,
 * whose nuclei are bare — then 1H is the CODATA 2018 proton mass.
 */
import { isotopeMassMe, type MassKind } from './isotope-masses';

export interface ReducedMassOptions {
  masses?: MassKind;
}

export function reducedMassMe(isotopes: readonly [string, string], options: ReducedMassOptions = {}): number {
  const kind = options.masses ?? 'atomic';
  const m1 = isotopeMassMe(isotopes[0], kind);
  const m2 = isotopeMassMe(isotopes[1], kind);
  return (m1 * m2) / (m1 + m2);
}
