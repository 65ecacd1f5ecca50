import { useMemo } from 'react';
import { describeCurveModel } from '@shared/chemistry/curves';
import type { ModelSpec } from '@shared/exercises/spec';
import type { Variant } from '@shared/exercises/variants';
import { computeReference, type CurveReference, type Reference } from '@shared/exercises/reference';
import { Num } from '@client/components/ui/num';
import { distanceQuantity, energyQuantity, type DistanceUnit, type EnergyUnit, type PlotUnits } from '../lib/units';
import { CurvePlot, type CurveSeries } from './curve-plot';
import { HuckelView } from './huckel-levels';
import { MoDiagramView } from './mo-diagram-view';

export interface ReferencePreviewProps {
  model: ModelSpec;
  variant: Variant;
  /** default: the unit of the exercise's R grid (curves) or Å (measured bond lengths beside diagrams) */
  distanceUnit?: DistanceUnit;
  /** default: hartree */
  energyUnit?: EnergyUnit;
}

type Computed = { ok: true; reference: Reference } | { ok: false; message: string };

/** computeReference without throwing: impossible parameters become a message. */
export function tryComputeReference(model: ModelSpec, variant: Variant): Computed {
  try {
    return { ok: true, reference: computeReference(model, variant) };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}

/** The series of a curve reference, coloured by state (σg bonding, σu antibonding). */
export function referenceSeries(reference: CurveReference): CurveSeries[] {
  return reference.curves.map((c) => ({
    id: c.state,
    label: c.label,
    kind: c.state === 'bonding' ? 'bonding' : 'antibonding',
    distanceBohr: reference.grid.bohr,
    energyHartree: c.energyHartree,
  }));
}

function CurveReferenceView({ reference, units }: { reference: CurveReference; units: PlotUnits }) {
  const series = useMemo(() => referenceSeries(reference), [reference]);
  const m = reference.minimum;
  const re = distanceQuantity(m?.reBohr, units.distance);
  const e = energyQuantity(m?.energyHartree, units.energy);
  const de = energyQuantity(m?.deHartree, units.energy);
  const limit = energyQuantity(reference.dissociationLimitHartree, units.energy);
  const description = describeCurveModel({ ...reference.params, state: reference.curves[0]?.state ?? 'bonding' });
  const zetaSeries = reference.curves.filter((c) => c.zeta);
  return (
    <div className="grid gap-3">
      <CurvePlot
        title={`Reference curves (${reference.model === 'exact' ? 'exact' : reference.model.startsWith('h2-') ? 'H₂' : 'LCAO'})`}
        description={description}
        series={series}
        units={units}
        markers={m ? [{ id: 'minimum', label: `Rₑ = ${re.text} ${re.unit}`, distanceBohr: m.reBohr, energyHartree: m.energyHartree, kind: 'reference' }] : []}
        limitHartree={reference.dissociationLimitHartree}
        secondPanel={
          zetaSeries.length > 0
            ? {
                title: 'Optimized orbital exponent',
                yLabel: 'ζ',
                csvQuantity: 'zeta',
                series: zetaSeries.map((c) => ({ id: `zeta-${c.state}`, label: c.label, kind: c.state === 'bonding' ? 'bonding' : 'antibonding', distanceBohr: reference.grid.bohr, values: c.zeta! })),
              }
            : undefined
        }
        testId="reference-curves"
      />
      <dl className="grid grid-cols-2 gap-x-6 gap-y-1 rounded-[3px] border border-rule bg-sheet px-3 py-2 text-[0.92rem] sm:grid-cols-4" data-testid="reference-numbers">
        <div>
          <dt className="text-[0.8rem] text-graphite">
            R<sub>e</sub>
          </dt>
          <dd data-testid="reference-re">
            {m ? (
              <>
                <Num>{re.text}</Num> {re.unit}
              </>
            ) : (
              <span className="text-graphite">no minimum</span>
            )}
          </dd>
        </div>
        <div>
          <dt className="text-[0.8rem] text-graphite">
            E(R<sub>e</sub>)
          </dt>
          <dd data-testid="reference-energy">
            <Num>{e.text}</Num> {m ? e.unit : null}
          </dd>
        </div>
        <div>
          <dt className="text-[0.8rem] text-graphite">
            D<sub>e</sub>
          </dt>
          <dd data-testid="reference-de">
            <Num>{de.text}</Num> {m ? de.unit : null}
          </dd>
        </div>
        <div>
          <dt className="text-[0.8rem] text-graphite">
            ω<sub>e</sub> ({reference.isotopes.join('–')})
          </dt>
          <dd data-testid="reference-omega">
            {reference.harmonicWavenumberCm1 === null ? (
              <span className="text-graphite">—</span>
            ) : (
              <>
                <Num>{reference.harmonicWavenumberCm1.toFixed(1)}</Num> cm⁻¹
              </>
            )}
          </dd>
        </div>
        <div>
          <dt className="text-[0.8rem] text-graphite">Dissociation limit</dt>
          <dd>
            <Num>{limit.text}</Num> {limit.unit}
          </dd>
        </div>
        {m?.zeta !== undefined ? (
          <div>
            <dt className="text-[0.8rem] text-graphite">
              ζ at R<sub>e</sub>
            </dt>
            <dd>
              <Num>{m.zeta.toFixed(4)}</Num>
            </dd>
          </div>
        ) : null}
        {reference.antibondingRepulsive !== null ? (
          <div>
            <dt className="text-[0.8rem] text-graphite">Antibonding curve</dt>
            <dd>{reference.antibondingRepulsive ? 'repulsive (no minimum)' : 'has a minimum'}</dd>
          </div>
        ) : null}
        <div>
          <dt className="text-[0.8rem] text-graphite">Grid</dt>
          <dd>
            <Num>{reference.grid.values.length}</Num> points
          </dd>
        </div>
      </dl>
    </div>
  );
}

/**
 * The Reference of one variant, computed in the browser: curves with the
 * analysis numbers (Re, E(Re), De, ωe) in the chosen units, the MO diagram with
 * its answer key, or the Hückel levels with coefficients, charges and bond
 * orders. Embedded in the exercise editor and used by the Reference explorer.
 */
export function ReferencePreview({ model, variant, distanceUnit, energyUnit = 'hartree' }: ReferencePreviewProps) {
  const computed = useMemo(() => tryComputeReference(model, variant), [model, variant]);
  if (!computed.ok) {
    return (
      <div role="alert" className="rounded-[3px] border border-antibonding/50 bg-sheet px-4 py-3" data-testid="reference-preview-error">
        <p className="font-semibold text-antibonding">No reference for this variant.</p>
        <p className="text-ink">{computed.message}</p>
      </div>
    );
  }
  const reference = computed.reference;
  return (
    <section aria-label={`Reference of variant ${variant.key}`} data-testid="reference-preview" data-reference-kind={reference.kind}>
      {reference.kind === 'curve' ? (
        <CurveReferenceView reference={reference} units={{ distance: distanceUnit ?? reference.grid.unit, energy: energyUnit }} />
      ) : reference.kind === 'diagram' ? (
        <MoDiagramView diagram={reference.diagram} distanceUnit={distanceUnit ?? 'angstrom'} />
      ) : (
        <HuckelView result={reference.result} name={reference.systemLabel} />
      )}
    </section>
  );
}
