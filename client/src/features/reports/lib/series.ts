/**
 * Point series from the API (in the student's units) → the CurvePlot's
 * series (bohr and hartree; the plot converts back to the units it is given).
 */
import { distanceToBohr, energyToHartree, type DistanceUnit, type EnergyUnit } from '@shared/chemistry/units';
import type { PointSeries } from '@shared/api/reports';
import type { CurveSeries, SeriesKind } from '@client/features/explorer/components/curve-plot';

export function toCurveSeries(series: readonly PointSeries[], units: { distance: DistanceUnit; energy: EnergyUnit }, kind: (s: PointSeries, i: number) => SeriesKind, prefix: string, dashed = false): CurveSeries[] {
  return series.map((s, i) => ({
    id: `${prefix}-${s.key}`,
    label: s.label,
    kind: kind(s, i),
    dashed,
    distanceBohr: s.points.map(([x]) => distanceToBohr(x, units.distance)),
    energyHartree: s.points.map(([, y]) => energyToHartree(y, units.energy)),
  }));
}

/** "2.1 kB", "340 B", "4.8 MB" */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/** "3 h 20 min", "2 days 4 h" */
export function durationText(minutes: number): string {
  const days = Math.floor(minutes / 1440);
  const hours = Math.floor((minutes % 1440) / 60);
  const mins = minutes % 60;
  if (days > 0) return `${days} ${days === 1 ? 'day' : 'days'}${hours ? ` ${hours} h` : ''}`;
  if (hours > 0) return `${hours} h${mins ? ` ${mins} min` : ''}`;
  return `${mins} min`;
}

/** Points as people read them: up to 4 decimals, at most 2 after a whole number ≥ 100; U+2212 minus. */
export function formatPoints(x: number): string {
  const text = Number.isInteger(x) ? String(x) : Math.abs(x) >= 100 ? x.toFixed(1) : String(Math.round(x * 100) / 100);
  return text.replace('-', '\u2212');
}
