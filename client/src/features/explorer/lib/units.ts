/**
 * Units the person chooses for plots and numbers, and how numbers are written
 * on screen (U+2212 minus, fixed decimals that suit each unit). Conversions
 * come from the engine (shared/chemistry/units, CODATA 2018).
 */
import {
  distanceFromBohr,
  distanceUnitLabel,
  distanceUnits,
  energyFromHartree,
  energyUnitLabel,
  energyUnits,
  type DistanceUnit,
  type EnergyUnit,
} from '@shared/chemistry/units';

export type { DistanceUnit, EnergyUnit };
export { distanceUnits, energyUnits };

export interface PlotUnits {
  distance: DistanceUnit;
  energy: EnergyUnit;
}

export const DEFAULT_UNITS: PlotUnits = { distance: 'bohr', energy: 'hartree' };

/** Names in pickers: the symbol and, where it helps, the word. */
export const distanceUnitOptionLabel: Record<DistanceUnit, string> = { bohr: 'bohr (a₀)', angstrom: 'ångström (Å)', pm: 'picometre (pm)' };
export const energyUnitOptionLabel: Record<EnergyUnit, string> = {
  hartree: 'hartree (Eₕ)',
  ev: 'electronvolt (eV)',
  'kj/mol': 'kJ mol⁻¹',
  'kcal/mol': 'kcal mol⁻¹',
  'cm-1': 'wavenumber (cm⁻¹)',
};

/** Plain-text unit names for CSV headers (no subscripts, so every spreadsheet reads them). */
export const distanceUnitCsv: Record<DistanceUnit, string> = { bohr: 'bohr', angstrom: 'angstrom', pm: 'pm' };
export const energyUnitCsv: Record<EnergyUnit, string> = { hartree: 'hartree', ev: 'eV', 'kj/mol': 'kJ/mol', 'kcal/mol': 'kcal/mol', 'cm-1': 'cm-1' };

/** Decimals shown for a value in each unit (enough for marking tolerances, not more). */
export const distanceDecimals: Record<DistanceUnit, number> = { bohr: 4, angstrom: 4, pm: 2 };
export const energyDecimals: Record<EnergyUnit, number> = { hartree: 6, ev: 4, 'kj/mol': 2, 'kcal/mol': 3, 'cm-1': 1 };

export function isDistanceUnit(value: unknown): value is DistanceUnit {
  return typeof value === 'string' && (distanceUnits as readonly string[]).includes(value);
}
export function isEnergyUnit(value: unknown): value is EnergyUnit {
  return typeof value === 'string' && (energyUnits as readonly string[]).includes(value);
}

/** A number with fixed decimals and a true minus sign; "—" for null, NaN or ±∞. */
export function formatFixed(value: number | null | undefined, decimals: number): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  const text = value.toFixed(decimals);
  // "-0.000" is zero
  if (/^-0(\.0*)?$/.test(text)) return text.slice(1);
  return text.replace(/^-/, '\u2212');
}

/** A number with `digits` significant figures for axis ticks ("1.5", "−0.25", "2.5e−5"). */
export function formatTick(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return '';
  if (value === 0) return '0';
  const abs = Math.abs(value);
  const text = abs >= 1e-3 && abs < 1e6 ? String(Number(value.toPrecision(digits))) : value.toExponential(Math.max(0, digits - 2)).replace(/\.?0+e/, 'e');
  return text.replace(/-/g, '\u2212').replace('e+', 'e');
}

export interface Quantity {
  /** the converted number */
  value: number | null;
  /** the formatted number */
  text: string;
  /** the unit symbol, e.g. "Å" */
  unit: string;
}

export function distanceQuantity(valueBohr: number | null | undefined, unit: DistanceUnit): Quantity {
  const value = valueBohr === null || valueBohr === undefined ? null : distanceFromBohr(valueBohr, unit);
  return { value, text: formatFixed(value, distanceDecimals[unit]), unit: distanceUnitLabel[unit] };
}

export function energyQuantity(valueHartree: number | null | undefined, unit: EnergyUnit): Quantity {
  const value = valueHartree === null || valueHartree === undefined ? null : energyFromHartree(valueHartree, unit);
  return { value, text: formatFixed(value, energyDecimals[unit]), unit: energyUnitLabel[unit] };
}

/** Axis titles: "R / Å", "E / kJ mol⁻¹" (quantity / unit, as IUPAC writes axis labels). */
export function distanceAxisLabel(unit: DistanceUnit): string {
  return `R / ${distanceUnitLabel[unit]}`;
}
export function energyAxisLabel(unit: EnergyUnit, symbol = 'E'): string {
  return `${symbol} / ${energyUnitLabel[unit]}`;
}

export { distanceUnitLabel, energyUnitLabel, distanceFromBohr, energyFromHartree };
