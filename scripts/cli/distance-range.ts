/**
 * Distances typed on the command line: `start:end:step` (inclusive of `end`
 * when it falls on the grid) or one number. Grid points are start + k·step,
 * rounded to the decimals the user typed, so 0.5:10:0.05 gives 0.65, not
 * 0.6500000000000001.
 */
import { CliInputError } from './command';

export const MAX_CURVE_POINTS = 100_000;

function decimalsOf(text: string): number | null {
  const t = text.trim();
  if (/e/i.test(t)) return null;
  const dot = t.indexOf('.');
  return dot < 0 ? 0 : t.length - dot - 1;
}

function parseNumber(text: string, what: string): number {
  const value = text.trim() === '' ? Number.NaN : Number(text);
  if (!Number.isFinite(value)) throw new CliInputError(`--r: ${what} must be a number, got '${text}'`);
  return value;
}

export function parseDistanceRange(text: string): number[] {
  const parts = text.split(':');
  if (parts.length !== 3) throw new CliInputError(`--r must be start:end:step in bohr (e.g. 0.5:10:0.05), got '${text}'`);
  const [start, end, step] = [parseNumber(parts[0], 'start'), parseNumber(parts[1], 'end'), parseNumber(parts[2], 'step')];
  if (!(start > 0)) throw new CliInputError(`--r: distances must be greater than 0 bohr, got start ${parts[0]}`);
  if (!(step > 0)) throw new CliInputError(`--r: step must be greater than 0, got ${parts[2]}`);
  if (end < start) throw new CliInputError(`--r: end ${parts[1]} lies below start ${parts[0]}`);
  const steps = Math.floor((end - start) / step + 1e-9);
  if (steps + 1 > MAX_CURVE_POINTS) throw new CliInputError(`--r gives ${steps + 1} points; at most ${MAX_CURVE_POINTS} are allowed`);
  const startDecimals = decimalsOf(parts[0]);
  const stepDecimals = decimalsOf(parts[2]);
  const decimals = startDecimals === null || stepDecimals === null ? null : Math.max(startDecimals, stepDecimals);
  const out: number[] = new Array(steps + 1);
  for (let k = 0; k <= steps; k++) {
    const value = start + k * step;
    out[k] = decimals !== null && decimals <= 15 ? Number(value.toFixed(decimals)) : value;
  }
  return out;
}

export function parseDistance(text: string): number {
  const value = text.trim() === '' ? Number.NaN : Number(text);
  if (!Number.isFinite(value)) throw new CliInputError(`--r must be one distance in bohr here (e.g. 2.0), got '${text}'`);
  if (!(value > 0)) throw new CliInputError(`--r: the distance must be greater than 0 bohr, got ${text}`);
  return value;
}
