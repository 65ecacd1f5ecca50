/**
 * Timing helpers for the benchmarks: warm-up, repeated samples, medians, and a
 * plain-text table. Times in milliseconds from performance.now().
 */
import { cpus, loadavg } from 'node:os';

/** a value the benchmarks add their results to, printed at the end so no work can be optimized away */
export const sink = { value: 0 };

export function consume(x: number | readonly number[] | ArrayLike<number>): void {
  if (typeof x === 'number') sink.value += x;
  else sink.value += x[0] + x[x.length - 1];
}

export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const mid = sorted.length >> 1;
  return sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

/** runs `fn` until `milliseconds` have passed (at least `minimumRuns` times) */
export function warmUp(fn: () => void, milliseconds = 300, minimumRuns = 5): void {
  const end = performance.now() + milliseconds;
  for (let i = 0; i < minimumRuns || performance.now() < end; i++) fn();
}

/** one sample = `repeat` calls of fn; returns the time per call of each sample, ms */
export function sample(fn: () => void, repeat: number): number {
  const start = performance.now();
  for (let i = 0; i < repeat; i++) fn();
  return (performance.now() - start) / repeat;
}

/**
 * Median time per call of each function, the samples taken in turn (a, b, c, a, b, c, …) so that
 * a change in machine load affects all of them alike.
 */
export function interleavedMedians(fns: ReadonlyArray<{ fn: () => void; repeat: number }>, samples: number): number[] {
  return interleavedSamples(fns, samples).map(median);
}

/** the samples themselves (time per call, ms), one array per function, taken in turn */
export function interleavedSamples(fns: ReadonlyArray<{ fn: () => void; repeat: number }>, samples: number): number[][] {
  const times = fns.map(() => [] as number[]);
  for (let s = 0; s < samples; s++) fns.forEach(({ fn, repeat }, i) => times[i].push(sample(fn, repeat)));
  return times;
}

/** median of the ratios of samples taken side by side: robust to load that drifts during the run */
export function pairedRatio(numerator: readonly number[], denominator: readonly number[]): number {
  return median(numerator.map((x, i) => x / denominator[i]));
}

export function machineLine(): string {
  const cores = cpus();
  const load = loadavg().map((x) => x.toFixed(2)).join(' ');
  return `machine: ${cores.length} cores (${cores[0]?.model.trim() ?? 'unknown cpu'}), Node ${process.version}, load average ${load}`;
}

/** left-aligned text table with a header rule */
export function formatTable(header: readonly string[], rows: ReadonlyArray<readonly string[]>): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
  const line = (cells: readonly string[]) => cells.map((c, i) => c.padEnd(widths[i])).join('  ').trimEnd();
  return [line(header), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n');
}

/** 0.0123 ms → "12.3 µs", 4.5 ms → "4.50 ms" */
export function formatMilliseconds(ms: number): string {
  if (ms < 1) return `${(ms * 1000).toPrecision(3)} µs`;
  return `${ms.toPrecision(3)} ms`;
}
