/**
 * Dissociation energy De = E(limit) − E(Re): depth of the well below the
 * dissociation limit of the same model (definition, e.g. Atkins' Physical
 * Chemistry, 11th ed., §9A; Huber & Herzberg, Constants of Diatomic Molecules,
 * 1979, Introduction). Positive for a bound curve. De excludes the zero-point
 * energy (D0 = De − ZPE is not computed here).
 */
import { energyFromHartree } from '../units';

export function dissociationEnergy(minEnergyHartree: number, limitHartree: number): number {
  if (!Number.isFinite(minEnergyHartree) || !Number.isFinite(limitHartree)) {
    throw new RangeError(`dissociationEnergy needs finite energies (got ${minEnergyHartree}, ${limitHartree}).`);
  }
  return limitHartree - minEnergyHartree;
}

/** De in electronvolts (CODATA 2018 factor via shared/chemistry/units). */
export function dissociationEnergyEv(minEnergyHartree: number, limitHartree: number): number {
  return energyFromHartree(dissociationEnergy(minEnergyHartree, limitHartree), 'ev');
}
