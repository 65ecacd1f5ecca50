/**
 * How precisely a report's energies were typed, recovered from the numbers themselves: the energy
 * unit in which they are shortest decimals (hartree, eV, kJ/mol, kcal/mol, cm⁻¹) and, per value,
 * half a unit in its last typed digit, in hartree. A value typed as "−15.37" eV converts to a
 * 16-digit hartree number, but times HARTREE_EV it is 15.37 again (within 1e−12 relative).
 * Plain decimal arithmetic; no published formula.
 */
import { energyFromHartree, energyUnits, type EnergyUnit } from '@shared/chemistry/units';

const MAX_DIGITS = 15;

/**
 * Fewest significant digits that give `value` back within 1e−12 relative (a full double needs 12).
 * `guess` (e.g. the previous value's count) only makes it faster: the walk starts there.
 */
export function significantDigits(value: number, guess = 6): number {
  if (value === 0 || !Number.isFinite(value)) return 1;
  const magnitude = Math.abs(value);
  const exponent = Math.floor(Math.log10(magnitude));
  // d digits fit when |value|·10^(d−1−exponent) is a whole number within 1e−12 relative
  const fits = (d: number) => {
    const x = magnitude * 10 ** (d - 1 - exponent);
    return Math.abs(x - Math.round(x)) <= 1e-12 * x;
  };
  let d = Math.min(MAX_DIGITS, Math.max(1, Math.round(guess)));
  if (fits(d)) {
    while (d > 1 && fits(d - 1)) d--;
    return d;
  }
  while (d < MAX_DIGITS && !fits(d + 1)) d++;
  return d < MAX_DIGITS ? d + 1 : 17;
}

export interface TypedPrecision {
  unit: EnergyUnit;
  /** half a unit in the last typed digit of each value, hartree (0 for exact zeros) */
  halfStepHartree: Float64Array;
  /** median of halfStepHartree */
  typicalHalfStepHartree: number;
}

function median(values: number[]): number {
  if (values.length === 0) return 0;
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : 0.5 * (sorted[mid - 1] + sorted[mid]);
}

export function typedPrecision(energyHartree: ArrayLike<number>): TypedPrecision {
  const n = energyHartree.length;
  // the unit: the one where a sample of the values needs the fewest digits (median)
  const sample: number[] = [];
  const stride = Math.max(1, Math.floor(n / 24));
  for (let i = 0; i < n; i += stride) if (Number.isFinite(energyHartree[i]) && energyHartree[i] !== 0) sample.push(energyHartree[i]);
  let unit: EnergyUnit = 'hartree';
  let best = Number.POSITIVE_INFINITY;
  for (const u of energyUnits) {
    let guess = 6;
    const m = median(sample.map((v) => (guess = significantDigits(energyFromHartree(v, u), guess))));
    if (m < best) { best = m; unit = u; }
  }
  const factor = energyFromHartree(1, unit);
  const halfStepHartree = new Float64Array(n);
  let guess = Number.isFinite(best) ? best : 6;
  for (let i = 0; i < n; i++) {
    const v = energyHartree[i] * factor;
    if (!Number.isFinite(v) || v === 0) continue;
    const digits = significantDigits(v, guess);
    guess = digits;
    halfStepHartree[i] = (0.5 * 10 ** (Math.floor(Math.log10(Math.abs(v))) - digits + 1)) / factor;
  }
  return { unit, halfStepHartree, typicalHalfStepHartree: median(Array.from(halfStepHartree)) };
}
