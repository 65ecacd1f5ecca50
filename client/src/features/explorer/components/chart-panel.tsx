import { useMemo } from 'react';
import { CartesianGrid, Line, LineChart, ReferenceDot, ReferenceLine, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import { PLOT_FONT_FAMILY, PLOT_TOKENS } from '../lib/plot-colors';
import { niceTicks } from '../lib/plot-domain';
import { formatTick } from '../lib/units';

export interface PanelSeries {
  id: string;
  label: string;
  color: string;
  dashed?: boolean;
  /** drawing order: lower layers first (references under the curves compared with them) */
  layer?: number;
  x: readonly number[];
  y: readonly number[];
}

export interface PanelMarker {
  id: string;
  label: string;
  x: number;
  y: number;
  color: string;
}

export interface PanelRule {
  id: string;
  label: string;
  /** horizontal at y, or vertical at x */
  y?: number;
  x?: number;
  color?: string;
}

export interface ChartPanelProps {
  series: readonly PanelSeries[];
  xLabel: string;
  yLabel: string;
  xDomain: [number, number];
  yDomain: [number, number];
  markers?: readonly PanelMarker[];
  rules?: readonly PanelRule[];
  height?: number;
  /** what a screen reader hears for this panel */
  ariaLabel: string;
  testId?: string;
}

const tick = { fill: PLOT_TOKENS.graphite, fontSize: 11, fontFamily: "'IBM Plex Mono', ui-monospace, monospace" };
const axisTitle = { fill: PLOT_TOKENS.ink, fontSize: 12, fontFamily: PLOT_FONT_FAMILY };

/**
 * One panel of a line plot (recharts): numeric x and y axes with round ticks,
 * lines drawn without animation and clipped to the frame, optional markers and
 * rules. Marked data-plot-panel so that its frame can export it.
 */
export function ChartPanel({ series, xLabel, yLabel, xDomain, yDomain, markers = [], rules = [], height = 300, ariaLabel, testId }: ChartPanelProps) {
  const data = useMemo(
    () =>
      series
        .map((s, order) => ({
          ...s,
          order,
          points: s.x.flatMap((x, i) => (Number.isFinite(x) && Number.isFinite(s.y[i]) ? [{ x, y: s.y[i] }] : [])),
        }))
        .sort((a, b) => (a.layer ?? 1) - (b.layer ?? 1) || a.order - b.order),
    [series],
  );
  const xTicks = useMemo(() => niceTicks(xDomain[0], xDomain[1], 8), [xDomain]);
  const yTicks = useMemo(() => niceTicks(yDomain[0], yDomain[1], 6), [yDomain]);

  return (
    <div data-plot-panel role="img" aria-label={ariaLabel} data-testid={testId} style={{ height }}>
      <ResponsiveContainer width="100%" height={height}>
        <LineChart margin={{ top: 10, right: 18, bottom: 26, left: 14 }} accessibilityLayer={false}>
          <CartesianGrid stroke={PLOT_TOKENS.rule} strokeDasharray="2 3" />
          <XAxis
            type="number"
            dataKey="x"
            domain={xDomain}
            ticks={xTicks}
            allowDataOverflow
            tickFormatter={(v: number) => formatTick(v)}
            tick={tick}
            stroke={PLOT_TOKENS.ruleStrong}
            label={{ value: xLabel, position: 'insideBottom', offset: -14, style: axisTitle }}
          />
          <YAxis
            type="number"
            dataKey="y"
            domain={yDomain}
            ticks={yTicks}
            allowDataOverflow
            width={72}
            tickFormatter={(v: number) => formatTick(v)}
            tick={tick}
            stroke={PLOT_TOKENS.ruleStrong}
            label={{ value: yLabel, angle: -90, position: 'insideLeft', offset: 4, style: { ...axisTitle, textAnchor: 'middle' } }}
          />
          {rules.map((r) =>
            r.y !== undefined ? (
              <ReferenceLine key={r.id} y={r.y} stroke={r.color ?? PLOT_TOKENS.ruleStrong} strokeDasharray="4 4" ifOverflow="hidden" label={{ value: r.label, position: 'insideTopRight', fill: PLOT_TOKENS.graphite, fontSize: 11 }} />
            ) : (
              <ReferenceLine key={r.id} x={r.x} stroke={r.color ?? PLOT_TOKENS.ruleStrong} strokeDasharray="4 4" ifOverflow="hidden" label={{ value: r.label, position: 'insideTopLeft', fill: PLOT_TOKENS.graphite, fontSize: 11 }} />
            ),
          )}
          {data.map((s) => (
            <Line
              key={s.id}
              name={s.label}
              data={s.points}
              dataKey="y"
              type="linear"
              stroke={s.color}
              strokeWidth={2}
              strokeDasharray={s.dashed ? '7 4' : undefined}
              dot={false}
              activeDot={false}
              isAnimationActive={false}
              connectNulls={false}
            />
          ))}
          {markers.map((m) => (
            <ReferenceDot
              key={m.id}
              x={m.x}
              y={m.y}
              r={4.5}
              fill={m.color}
              stroke={PLOT_TOKENS.paper}
              strokeWidth={1.5}
              ifOverflow="hidden"
              label={{ value: m.label, position: 'bottom', fill: PLOT_TOKENS.ink, fontSize: 11, offset: 8 }}
            />
          ))}
        </LineChart>
      </ResponsiveContainer>
    </div>
  );
}
