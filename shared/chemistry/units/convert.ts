/**
 * Conversions between the engine's atomic units and the units people type.
 * Factors: CODATA 2018 (see constants.ts).
 */
import {
  BOHR_ANGSTROM,
  BOHR_PM,
  HARTREE_EV,
  HARTREE_KCAL_PER_MOL,
  HARTREE_KJ_PER_MOL,
  HARTREE_WAVENUMBER,
} from './constants';

export const distanceUnits = ['bohr', 'angstrom', 'pm'] as const;
export type DistanceUnit = (typeof distanceUnits)[number];
export const energyUnits = ['hartree', 'ev', 'kj/mol', 'kcal/mol', 'cm-1'] as const;
export type EnergyUnit = (typeof energyUnits)[number];

/** how many of each unit make one bohr */
const unitsPerBohr: Record<DistanceUnit, number> = {
  bohr: 1,
  angstrom: BOHR_ANGSTROM,
  pm: BOHR_PM,
};
/** how many of each unit make one hartree */
const unitsPerHartree: Record<EnergyUnit, number> = {
  hartree: 1,
  ev: HARTREE_EV,
  'kj/mol': HARTREE_KJ_PER_MOL,
  'kcal/mol': HARTREE_KCAL_PER_MOL,
  'cm-1': HARTREE_WAVENUMBER,
};

export function distanceToBohr(value: number, unit: DistanceUnit): number {
  return value / unitsPerBohr[unit];
}
export function distanceFromBohr(valueBohr: number, unit: DistanceUnit): number {
  return valueBohr * unitsPerBohr[unit];
}
export function energyToHartree(value: number, unit: EnergyUnit): number {
  return value / unitsPerHartree[unit];
}
export function energyFromHartree(valueHartree: number, unit: EnergyUnit): number {
  return valueHartree * unitsPerHartree[unit];
}
export function convertDistance(value: number, from: DistanceUnit, to: DistanceUnit): number {
  return distanceFromBohr(distanceToBohr(value, from), to);
}
export function convertEnergy(value: number, from: EnergyUnit, to: EnergyUnit): number {
  return energyFromHartree(energyToHartree(value, from), to);
}

export const distanceUnitLabel: Record<DistanceUnit, string> = { bohr: 'a₀', angstrom: 'Å', pm: 'pm' };
export const energyUnitLabel: Record<EnergyUnit, string> = {
  hartree: 'Eₕ',
  ev: 'eV',
  'kj/mol': 'kJ mol⁻¹',
  'kcal/mol': 'kcal mol⁻¹',
  'cm-1': 'cm⁻¹',
};
