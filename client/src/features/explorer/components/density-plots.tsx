import { useId, useMemo } from 'react';
import type { DensityPlane } from '@shared/chemistry/density';
import { distanceFromBohr, distanceUnitLabel } from '@shared/chemistry/units';
import { buildCsv, seriesCsv } from '../lib/csv';
import { densityAtScale, densityColor, densityPixels, gridMax, DENSITY_STOPS } from '../lib/density-palette';
import type { DensitySet } from '../lib/explorer-compute';
import { PLOT_FONT_FAMILY, PLOT_TOKENS, seriesColor } from '../lib/plot-colors';
import { plainDomain } from '../lib/plot-domain';
import { distanceQuantity, distanceUnitCsv, formatTick, type DistanceUnit } from '../lib/units';
import { ChartPanel, type PanelRule, type PanelSeries } from './chart-panel';
import { PlotFrame } from './plot-frame';

/** bohr⁻³ → unit⁻³ */
function densityFactor(unit: DistanceUnit): number {
  return 1 / distanceFromBohr(1, unit) ** 3;
}
const densityUnitLabel = (unit: DistanceUnit) => `${distanceUnitLabel[unit]}⁻³`;
const densityUnitCsv = (unit: DistanceUnit) => `${distanceUnitCsv[unit]}^-3`;

function orbitalNames(homonuclear: boolean) {
  return homonuclear ? { bonding: 'σg (bonding)', antibonding: 'σu* (antibonding)' } : { bonding: 'lower σ (bonding)', antibonding: 'upper σ* (antibonding)' };
}

/** ψ² of the bonding and antibonding orbitals along the bond axis, nuclei and midpoint marked. */
export function DensityLinePlot({ set, unit }: { set: DensitySet; unit: DistanceUnit }) {
  const f = densityFactor(unit);
  const series: PanelSeries[] = useMemo(() => {
    const names = orbitalNames(set.homonuclear);
    return (['bonding', 'antibonding'] as const).map((s) => ({
        id: s,
        label: `ψ² ${names[s]}`,
        color: seriesColor(s),
        dashed: s === 'antibonding',
        x: set.line[s].zBohr.map((z) => distanceFromBohr(z, unit)),
        y: set.line[s].density.map((d) => d * f),
      }));
  }, [set, unit, f]);
  const half = distanceFromBohr(set.distanceBohr / 2, unit);
  const extent = distanceFromBohr(set.extentBohr, unit);
  const rules: PanelRule[] = [
    { id: 'a', label: 'A', x: -half },
    { id: 'b', label: 'B', x: half },
    ...(set.homonuclear ? [{ id: 'mid', label: 'midpoint', x: 0, color: PLOT_TOKENS.rule }] : []),
  ];
  const r = distanceQuantity(set.distanceBohr, unit);
  const yDomain = useMemo(() => plainDomain(series), [series]);
  return (
    <PlotFrame
      title="Orbital density along the bond axis"
      description={`R = ${r.text} ${r.unit}; nucleus A at −R/2, B at +R/2`}
      legend={series.map((s) => ({ label: s.label, color: s.color, dashed: s.dashed }))}
      csv={() =>
        seriesCsv(
          `z / ${distanceUnitCsv[unit]}`,
          series.map((s) => ({ header: `${s.label} / ${densityUnitCsv(unit)}`, x: s.x, y: s.y })),
        )
      }
      testId="density-line"
    >
      <ChartPanel
        series={series}
        xLabel={`z / ${distanceUnitLabel[unit]}`}
        yLabel={`ψ² / ${densityUnitLabel(unit)}`}
        xDomain={[-extent, extent]}
        yDomain={yDomain}
        rules={rules}
        height={260}
        ariaLabel={`ψ² along the bond axis at R = ${r.text} ${r.unit}: the bonding density builds up between the nuclei${set.homonuclear ? ', the antibonding density is zero at the midpoint' : ''}.`}
      />
    </PlotFrame>
  );
}

/** The heat map image of one plane as a PNG data URL (browser only). */
function planeImage(plane: DensityPlane, max: number): string | null {
  if (typeof document === 'undefined') return null;
  const ny = plane.density.length;
  const nx = ny ? plane.density[0].length : 0;
  const canvas = document.createElement('canvas');
  canvas.width = nx;
  canvas.height = ny;
  const ctx = canvas.getContext('2d');
  if (!ctx) return null;
  const pixels = densityPixels(plane.density, max);
  ctx.putImageData(new ImageData(pixels as unknown as Uint8ClampedArray<ArrayBuffer>, nx, ny), 0, 0);
  return canvas.toDataURL('image/png');
}

const MAP = { size: 250, left: 44, top: 26, bar: 14, gapToBar: 14, right: 66, bottom: 40 } as const;

function HeatmapPanel({ plane, title, set, unit, nodal, testId }: { plane: DensityPlane; title: string; set: DensitySet; unit: DistanceUnit; nodal: boolean; testId: string }) {
  const gradientId = useId().replace(/:/g, '');
  const max = useMemo(() => gridMax(plane.density), [plane]);
  const href = useMemo(() => planeImage(plane, max), [plane, max]);
  const width = MAP.left + MAP.size + MAP.gapToBar + MAP.bar + MAP.right;
  const height = MAP.top + MAP.size + MAP.bottom;
  const ext = set.extentBohr;
  const px = (xBohr: number) => MAP.left + ((xBohr + ext) / (2 * ext)) * MAP.size;
  const py = (yBohr: number) => MAP.top + ((ext - yBohr) / (2 * ext)) * MAP.size;
  const f = densityFactor(unit);
  const ticks = [-ext, -ext / 2, 0, ext / 2, ext];
  const barX = MAP.left + MAP.size + MAP.gapToBar;
  const barTicks = [0, 0.5, 1];
  return (
    <svg
      viewBox={`0 0 ${width} ${height}`}
      width="100%"
      style={{ maxWidth: width, height: 'auto', display: 'block' }}
      role="img"
      aria-label={`${title}: ψ² on a plane through both nuclei${nodal ? '; the density vanishes on the nodal plane through the midpoint' : ''}. Largest value ${formatTick(max * f, 3)} ${densityUnitLabel(unit)}.`}
      data-plot-panel
      data-testid={testId}
      fontFamily={PLOT_FONT_FAMILY}
      xmlns="http://www.w3.org/2000/svg"
    >
      <defs>
        <linearGradient id={gradientId} x1="0" y1="1" x2="0" y2="0">
          {/* the bar is on the same square-root scale as the map */}
          {DENSITY_STOPS.map(([t, color]) => (
            <stop key={t} offset={t} stopColor={color} />
          ))}
        </linearGradient>
      </defs>
      <rect x={0} y={0} width={width} height={height} fill={PLOT_TOKENS.sheet} />
      <text x={MAP.left} y={16} fontSize={13} fontWeight={600} fill={PLOT_TOKENS.ink}>
        {title}
      </text>
      {href ? (
        <image href={href} x={MAP.left} y={MAP.top} width={MAP.size} height={MAP.size} preserveAspectRatio="none" />
      ) : (
        <rect x={MAP.left} y={MAP.top} width={MAP.size} height={MAP.size} fill={`rgb(${densityColor(0).join(',')})`} />
      )}
      <rect x={MAP.left} y={MAP.top} width={MAP.size} height={MAP.size} fill="none" stroke={PLOT_TOKENS.ruleStrong} />
      {nodal ? (
        <g>
          <line x1={px(0)} y1={MAP.top} x2={px(0)} y2={MAP.top + MAP.size} stroke={PLOT_TOKENS.antibonding} strokeWidth={1.4} strokeDasharray="5 4" />
          <text x={px(0) + 4} y={MAP.top + 12} fontSize={10.5} fill={PLOT_TOKENS.antibonding} paintOrder="stroke" stroke={PLOT_TOKENS.paper} strokeWidth={3}>
            nodal plane
          </text>
        </g>
      ) : null}
      {[
        { x: -set.distanceBohr / 2, name: 'A' },
        { x: set.distanceBohr / 2, name: 'B' },
      ].map((n) => (
        <g key={n.name}>
          <circle cx={px(n.x)} cy={py(0)} r={3.5} fill={PLOT_TOKENS.paper} stroke={PLOT_TOKENS.caution} strokeWidth={1.8} />
          <text x={px(n.x)} y={py(0) + 16} fontSize={11} fontWeight={600} fill={PLOT_TOKENS.caution} textAnchor="middle" paintOrder="stroke" stroke={PLOT_TOKENS.paper} strokeWidth={3}>
            {n.name}
          </text>
        </g>
      ))}
      <g fontSize={10} fill={PLOT_TOKENS.graphite} fontFamily="'IBM Plex Mono', ui-monospace, monospace">
        {ticks.map((t) => (
          <g key={`x${t}`}>
            <line x1={px(t)} y1={MAP.top + MAP.size} x2={px(t)} y2={MAP.top + MAP.size + 4} stroke={PLOT_TOKENS.ruleStrong} />
            <text x={px(t)} y={MAP.top + MAP.size + 15} textAnchor="middle">
              {formatTick(distanceFromBohr(t, unit), 3)}
            </text>
            <line x1={MAP.left - 4} y1={py(t)} x2={MAP.left} y2={py(t)} stroke={PLOT_TOKENS.ruleStrong} />
            <text x={MAP.left - 6} y={py(t) + 3} textAnchor="end">
              {formatTick(distanceFromBohr(t, unit), 3)}
            </text>
          </g>
        ))}
      </g>
      <text x={MAP.left + MAP.size / 2} y={height - 6} fontSize={11.5} fill={PLOT_TOKENS.ink} textAnchor="middle">
        x along the bond / {distanceUnitLabel[unit]}
      </text>
      <rect x={barX} y={MAP.top} width={MAP.bar} height={MAP.size} fill={`url(#${gradientId})`} stroke={PLOT_TOKENS.ruleStrong} />
      <g fontSize={10} fill={PLOT_TOKENS.graphite} fontFamily="'IBM Plex Mono', ui-monospace, monospace">
        {barTicks.map((t) => (
          <text key={t} x={barX + MAP.bar + 4} y={MAP.top + (1 - t) * MAP.size + 3}>
            {formatTick(densityAtScale(t, max) * f, 3)}
          </text>
        ))}
      </g>
      <text x={barX + MAP.bar + 4} y={MAP.top + MAP.size + 15} fontSize={10} fill={PLOT_TOKENS.graphite}>
        ψ² / {densityUnitLabel(unit)}
      </text>
    </svg>
  );
}

/** ψ² of both orbitals on a plane containing the nuclei, as two heat maps (square-root colour scale). */
export function DensityPlaneMaps({ set, unit }: { set: DensitySet; unit: DistanceUnit }) {
  const names = orbitalNames(set.homonuclear);
  const r = distanceQuantity(set.distanceBohr, unit);
  const f = densityFactor(unit);
  const csv = () => {
    const { x, y, density } = set.plane.bonding;
    const anti = set.plane.antibonding.density;
    const rows: (number | null)[][] = [];
    y.forEach((yj, j) => x.forEach((xi, i) => rows.push([distanceFromBohr(xi, unit), distanceFromBohr(yj, unit), density[j][i] * f, anti[j][i] * f])));
    const u = distanceUnitCsv[unit];
    return buildCsv([`x / ${u}`, `y / ${u}`, `psi^2 ${names.bonding} / ${densityUnitCsv(unit)}`, `psi^2 ${names.antibonding} / ${densityUnitCsv(unit)}`], rows);
  };
  return (
    <PlotFrame
      title="Orbital density on a plane through both nuclei"
      description={`R = ${r.text} ${r.unit}; colour on a square-root scale of ψ², so that the bond region shows beside the nuclear cusps`}
      csv={csv}
      testId="density-plane"
    >
      <div className="grid gap-2 sm:grid-cols-2">
        <HeatmapPanel plane={set.plane.bonding} title={`ψ² ${names.bonding}`} set={set} unit={unit} nodal={false} testId="density-map-bonding" />
        <HeatmapPanel plane={set.plane.antibonding} title={`ψ² ${names.antibonding}`} set={set} unit={unit} nodal={set.homonuclear} testId="density-map-antibonding" />
      </div>
    </PlotFrame>
  );
}
