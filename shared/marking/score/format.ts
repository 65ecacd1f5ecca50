/**
 * Numbers and units in feedback sentences: values shown with as many decimals as the tolerance
 * needs, deviations with two significant figures, the units the student wrote in.
 */
import {
  distanceFromBohr,
  distanceUnitLabel,
  energyFromHartree,
  energyUnitLabel,
  type DistanceUnit,
  type EnergyUnit,
} from '@shared/chemistry/units';
import { roundPoints } from './credit';

/** Minus sign as U+2212 so that numbers read well in sentences. */
function withMinus(text: string): string {
  return text.startsWith('-') ? `−${text.slice(1)}` : text;
}

/** Decimals that resolve a tenth of `step` (at least 0, at most 8). */
export function decimalsFor(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 3;
  return Math.max(0, Math.min(8, Math.ceil(-Math.log10(step)) + 1));
}

/** A value with `decimals` decimals. */
export function formatFixed(value: number, decimals: number): string {
  if (!Number.isFinite(value)) return String(value);
  const text = value.toFixed(decimals);
  return withMinus(/^-0(\.0*)?$/.test(text) ? text.slice(1) : text);
}

const SUPERSCRIPT: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };
function superscript(text: string): string {
  return [...text].map((c) => SUPERSCRIPT[c] ?? c).join('');
}

/** Two significant figures, exponent form below 1e−3 (deviations, tolerances). */
export function formatSmall(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return '0';
  const a = Math.abs(value);
  if (a < 1e-3 || a >= 1e6) {
    const [mantissa, exponent] = value.toExponential(1).split('e');
    return `${withMinus(mantissa)}×10${superscript(exponent.replace('+', ''))}`;
  }
  return withMinus(String(Number(value.toPrecision(2))));
}

/** A tolerance as written in the scheme, trimmed ("0.005", "20"). */
export function formatTolerance(value: number): string {
  if (value === 0) return '0';
  const a = Math.abs(value);
  if (a < 1e-3) return formatSmall(value);
  return withMinus(String(Number(value.toPrecision(3))));
}

/** "1.6 of 2 points", "1 of 1 point" */
export function formatPoints(points: number, max: number): string {
  const p = roundPoints(points);
  const m = roundPoints(max);
  return `${p} of ${m} point${m === 1 ? '' : 's'}`;
}

export const distanceLabel = (unit: DistanceUnit) => distanceUnitLabel[unit];
export const energyLabel = (unit: EnergyUnit) => energyUnitLabel[unit];

export function distanceIn(valueBohr: number, unit: DistanceUnit): number {
  return distanceFromBohr(valueBohr, unit);
}
export function energyIn(valueHartree: number, unit: EnergyUnit): number {
  return energyFromHartree(valueHartree, unit);
}
