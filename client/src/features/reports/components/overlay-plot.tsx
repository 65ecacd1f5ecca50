import type { Overlay } from '@shared/api/reports';
import { CurvePlot } from '@client/features/explorer/components/curve-plot';
import { toCurveSeries } from '../lib/series';

/** The student's points against the reference on their common range, in the student's units. */
export function OverlayPlot({ overlay, title = 'Your data against the reference', fileBase }: { overlay: Overlay; title?: string; fileBase?: string }) {
  const units = { distance: overlay.distanceUnit, energy: overlay.energyUnit };
  const series = [
    ...toCurveSeries(overlay.reference, units, (s) => (s.key === 'antibonding' ? 'antibonding' : 'reference'), 'reference'),
    ...toCurveSeries(overlay.student, units, () => 'student', 'student', true),
  ];
  return (
    <CurvePlot
      series={series}
      units={units}
      title={title}
      description={overlay.convention === 'relative' ? 'Energies relative to the dissociation limit, as in the file.' : undefined}
      fileBase={fileBase}
      testId="overlay-plot"
    />
  );
}
