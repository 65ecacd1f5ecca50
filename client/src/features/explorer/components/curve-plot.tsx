import { useMemo, type ReactNode } from 'react';
import { distanceFromBohr, energyFromHartree } from '@shared/chemistry/units';
import { seriesCsv, type CsvColumnSeries } from '../lib/csv';
import { assignSeriesColors, seriesColor, type SeriesKind } from '../lib/plot-colors';
import { curveEnergyDomain, plainDomain, xExtent } from '../lib/plot-domain';
import {
  distanceAxisLabel,
  distanceQuantity,
  distanceUnitCsv,
  energyAxisLabel,
  energyQuantity,
  energyUnitCsv,
  type PlotUnits,
} from '../lib/units';
import { ChartPanel, type PanelMarker, type PanelRule, type PanelSeries } from './chart-panel';
import { PlotFrame } from './plot-frame';

export type { SeriesKind };

/** One curve: energies (hartree) at distances (bohr); converted to the chosen units for display. */
export interface CurveSeries {
  id: string;
  label: string;
  kind: SeriesKind;
  distanceBohr: readonly number[];
  energyHartree: readonly number[];
  dashed?: boolean;
}

/** A point to mark, e.g. the minimum (Re, E(Re)). */
export interface CurveMarker {
  id: string;
  label: string;
  distanceBohr: number;
  energyHartree: number;
  kind?: SeriesKind;
}

/** A second panel under the curves, sharing their R axis (e.g. ζ(R), or S against R). */
export interface CurveSecondPanel {
  title: string;
  /** y axis title with its unit, e.g. "ζ" or "S" */
  yLabel: string;
  /** column header part for the CSV, e.g. "zeta" */
  csvQuantity: string;
  series: Array<{ id: string; label: string; kind: SeriesKind; distanceBohr: readonly number[]; values: readonly number[]; dashed?: boolean }>;
  fromZero?: boolean;
}

export interface CurvePlotProps {
  series: readonly CurveSeries[];
  units: PlotUnits;
  markers?: readonly CurveMarker[];
  /** plot title (also the start of file names) */
  title?: string;
  description?: ReactNode;
  /** dashed horizontal line, e.g. the dissociation limit */
  limitHartree?: number | null;
  limitLabel?: string;
  /** fix the energy range (hartree); default: from just under the lowest point to a little above the long-R end */
  energyDomainHartree?: [number, number];
  secondPanel?: CurveSecondPanel;
  height?: number;
  fileBase?: string;
  downloads?: boolean;
  status?: ReactNode;
  testId?: string;
}

/** CSV of curves in the chosen units: R, then one energy column per series (and the second panel's columns). */
export function curvesCsv(series: readonly CurveSeries[], units: PlotUnits, secondPanel?: CurveSecondPanel): string {
  const dUnit = distanceUnitCsv[units.distance];
  const eUnit = energyUnitCsv[units.energy];
  const columns: CsvColumnSeries[] = series.map((s) => ({
    header: `E ${s.label} / ${eUnit}`,
    x: s.distanceBohr.map((r) => distanceFromBohr(r, units.distance)),
    y: s.energyHartree.map((e) => energyFromHartree(e, units.energy)),
  }));
  for (const s of secondPanel?.series ?? []) {
    columns.push({ header: `${secondPanel!.csvQuantity} ${s.label}`, x: s.distanceBohr.map((r) => distanceFromBohr(r, units.distance)), y: s.values });
  }
  return seriesCsv(`R / ${dUnit}`, columns);
}

/**
 * Potential-energy curves in the units the person chose: reference curves in
 * the reference colour family, σg/σu in the bonding/antibonding tokens, the
 * student's data in the student colour; optional minimum markers, a dashed
 * dissociation limit and a second panel on the same R axis. Downloads as
 * SVG, PNG and CSV (in the chosen units).
 */
export function CurvePlot({
  series,
  units,
  markers = [],
  title = 'Potential-energy curves',
  description,
  limitHartree = null,
  limitLabel = 'dissociation limit',
  energyDomainHartree,
  secondPanel,
  height = 320,
  fileBase,
  downloads = true,
  status,
  testId,
}: CurvePlotProps) {
  const colors = useMemo(() => assignSeriesColors(series.map((s) => s.kind)), [series]);

  const panelSeries: PanelSeries[] = useMemo(
    () =>
      series.map((s, i) => ({
        id: s.id,
        label: s.label,
        color: colors[i],
        dashed: s.dashed,
        layer: s.kind === 'reference' ? 0 : 1,
        x: s.distanceBohr.map((r) => distanceFromBohr(r, units.distance)),
        y: s.energyHartree.map((e) => energyFromHartree(e, units.energy)),
      })),
    [series, colors, units],
  );

  const xDomain = useMemo(() => xExtent([...panelSeries, ...(secondPanel?.series ?? []).map((s) => ({ x: s.distanceBohr.map((r) => distanceFromBohr(r, units.distance)), y: s.values }))]), [panelSeries, secondPanel, units]);
  const yDomain = useMemo<[number, number]>(
    () => (energyDomainHartree ? [energyFromHartree(energyDomainHartree[0], units.energy), energyFromHartree(energyDomainHartree[1], units.energy)] : curveEnergyDomain(panelSeries)),
    [energyDomainHartree, panelSeries, units],
  );

  const panelMarkers: PanelMarker[] = markers.map((m) => {
    const r = distanceQuantity(m.distanceBohr, units.distance);
    return {
      id: m.id,
      label: m.label || `${r.text} ${r.unit}`,
      x: distanceFromBohr(m.distanceBohr, units.distance),
      y: energyFromHartree(m.energyHartree, units.energy),
      color: seriesColor(m.kind ?? 'other', m.kind ? 0 : 2),
    };
  });
  const rules: PanelRule[] = limitHartree === null || !Number.isFinite(limitHartree) ? [] : [{ id: 'limit', label: limitLabel, y: energyFromHartree(limitHartree, units.energy) }];

  const second = useMemo(() => {
    if (!secondPanel) return null;
    const c = assignSeriesColors(secondPanel.series.map((s) => s.kind));
    const s: PanelSeries[] = secondPanel.series.map((p, i) => ({ id: p.id, label: p.label, color: c[i], dashed: p.dashed, x: p.distanceBohr.map((r) => distanceFromBohr(r, units.distance)), y: p.values }));
    return { series: s, domain: plainDomain(s, secondPanel.fromZero ?? false) };
  }, [secondPanel, units]);

  const ariaLabel = useMemo(() => {
    const parts = series.map((s) => s.label);
    const marks = markers.map((m) => {
      const r = distanceQuantity(m.distanceBohr, units.distance);
      const e = energyQuantity(m.energyHartree, units.energy);
      return `${m.label || 'marked point'} at R = ${r.text} ${r.unit}, E = ${e.text} ${e.unit}`;
    });
    return `Energy against distance: ${parts.join(', ')}${marks.length ? `. ${marks.join('; ')}` : ''}.`;
  }, [series, markers, units]);

  const legend = [
    ...series.map((s, i) => ({ label: s.label, color: colors[i], dashed: s.dashed })),
    ...(second ? second.series.map((s) => ({ label: `${secondPanel!.yLabel}: ${s.label}`, color: s.color, dashed: s.dashed })) : []),
    ...panelMarkers.map((m) => ({ label: m.label, color: m.color, dot: true })),
  ];

  return (
    <PlotFrame
      title={title}
      description={description}
      fileBase={fileBase}
      csv={() => curvesCsv(series, units, secondPanel)}
      legend={legend}
      downloads={downloads}
      status={status}
      testId={testId}
    >
      <ChartPanel
        series={panelSeries}
        xLabel={distanceAxisLabel(units.distance)}
        yLabel={energyAxisLabel(units.energy)}
        xDomain={xDomain}
        yDomain={yDomain}
        markers={panelMarkers}
        rules={rules}
        height={height}
        ariaLabel={ariaLabel}
      />
      {second && secondPanel ? (
        <>
          <p className="mt-1 px-2 text-[0.85rem] font-semibold text-graphite">{secondPanel.title}</p>
          <ChartPanel
            series={second.series}
            xLabel={distanceAxisLabel(units.distance)}
            yLabel={secondPanel.yLabel}
            xDomain={xDomain}
            yDomain={second.domain}
            height={Math.round(height * 0.55)}
            ariaLabel={`${secondPanel.title} against distance: ${second.series.map((s) => s.label).join(', ')}`}
          />
        </>
      ) : null}
    </PlotFrame>
  );
}
