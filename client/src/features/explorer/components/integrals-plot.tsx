import { useMemo } from 'react';
import { distanceFromBohr, energyFromHartree } from '@shared/chemistry/units';
import { buildCsv } from '../lib/csv';
import type { IntegralCurves } from '../lib/explorer-compute';
import { seriesColor } from '../lib/plot-colors';
import { plainDomain, xExtent } from '../lib/plot-domain';
import { distanceAxisLabel, distanceUnitCsv, energyAxisLabel, energyUnitCsv, type PlotUnits } from '../lib/units';
import { ChartPanel, type PanelSeries } from './chart-panel';
import { PlotFrame } from './plot-frame';

/**
 * The overlap S, Coulomb J and resonance K integrals of the minimal LCAO
 * against R: J and K in the chosen energy unit, S (a pure number) in its own panel.
 */
export function IntegralsPlot({ integrals, units }: { integrals: IntegralCurves; units: PlotUnits }) {
  const x = useMemo(() => integrals.distanceBohr.map((r) => distanceFromBohr(r, units.distance)), [integrals, units.distance]);
  const energies: PanelSeries[] = useMemo(
    () => [
      { id: 'J', label: 'J, Coulomb integral', color: seriesColor('reference'), x, y: integrals.coulombHartree.map((v) => energyFromHartree(v, units.energy)) },
      { id: 'K', label: 'K, resonance integral', color: seriesColor('other', 1), dashed: true, x, y: integrals.resonanceHartree.map((v) => energyFromHartree(v, units.energy)) },
    ],
    [integrals, units.energy, x],
  );
  const overlap: PanelSeries[] = useMemo(() => [{ id: 'S', label: 'S, overlap integral', color: seriesColor('other', 0), x, y: integrals.overlap }], [integrals, x]);
  const xDomain = useMemo(() => xExtent(energies), [energies]);
  const csv = () =>
    buildCsv(
      [`R / ${distanceUnitCsv[units.distance]}`, 'zeta', 'S', `J / ${energyUnitCsv[units.energy]}`, `K / ${energyUnitCsv[units.energy]}`],
      x.map((r, i) => [r, integrals.zeta[i], integrals.overlap[i], energies[0].y[i], energies[1].y[i]]),
    );
  return (
    <PlotFrame
      title="Overlap, Coulomb and resonance integrals"
      description={`S = e^(−w)(1 + w + w²/3), J = (1/R)[1 − (1 + w)e^(−2w)], K = ζ(1 + w)e^(−w), w = ζR; ${integrals.zetaNote}`}
      legend={[...energies, ...overlap].map((s) => ({ label: s.label, color: s.color, dashed: s.dashed }))}
      csv={csv}
      testId="integrals-plot"
    >
      <ChartPanel
        series={energies}
        xLabel={distanceAxisLabel(units.distance)}
        yLabel={energyAxisLabel(units.energy, 'J, K')}
        xDomain={xDomain}
        yDomain={plainDomain(energies)}
        height={220}
        ariaLabel="Coulomb integral J and resonance integral K against distance; both fall towards zero at long range."
      />
      <ChartPanel
        series={overlap}
        xLabel={distanceAxisLabel(units.distance)}
        yLabel="S"
        xDomain={xDomain}
        yDomain={[0, 1]}
        height={160}
        ariaLabel="Overlap integral S against distance, from near 1 at short range towards 0."
      />
    </PlotFrame>
  );
}
