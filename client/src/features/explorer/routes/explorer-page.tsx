import { useCallback, useDeferredValue, useId, useMemo } from 'react';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { ApiError } from '@client/lib/api';
import { PageHeader } from '@client/components/ui/page-header';
import { requireMe } from '@client/features/session/lib/require-session';
import { isStaff } from '@client/features/session/lib/roles';
import { CurveAnalysisTable } from '../components/curve-analysis-table';
import { CurvePlot } from '../components/curve-plot';
import { DensityLinePlot, DensityPlaneMaps } from '../components/density-plots';
import { CheckboxField, FieldShell, inputClass, NumberField, SelectField, useCommittedText } from '../components/fields';
import { HuckelView } from '../components/huckel-levels';
import { IntegralsPlot } from '../components/integrals-plot';
import { MoDiagramView } from '../components/mo-diagram-view';
import { computeExplorerView, type CurveView, type ExplorerView } from '../lib/explorer-compute';
import {
  explorerFamilies,
  explorerSearchParams,
  familyLabel,
  LIMITS,
  parseExplorerState,
  type ExplorerFamily,
  type ExplorerState,
  type HuckelKind,
  type LevelOrder,
} from '../lib/explorer-state';
import { distanceUnitOptionLabel, distanceUnits, energyUnitOptionLabel, energyUnits, type PlotUnits } from '../lib/units';

/** Staff only (lecturers, assistants, admins); students get a 403 page. */
export async function explorerLoader({ request }: LoaderFunctionArgs) {
  const me = await requireMe(request);
  if (!isStaff(me)) throw new ApiError(403, 'forbidden', 'The Reference explorer is for lecturers, assistants and admins.');
  return null;
}

const SPECIES_SUGGESTIONS = ['H2', 'H2+', 'He2', 'He2+', 'Li2', 'Be2', 'B2', 'C2', 'N2', 'N2+', 'O2', 'O2+', 'O2-', 'O2^2-', 'F2', 'Ne2', 'CO', 'CN-', 'NO', 'NO+', 'BN', 'HF', 'OH'];

/** Which keys feed the computation (units only change how results are shown). */
function computeKey(params: URLSearchParams): string {
  const p = new URLSearchParams(params);
  p.delete('du');
  p.delete('eu');
  p.sort();
  return p.toString();
}

function Busy({ busy }: { busy: boolean }) {
  return (
    <span role="status" aria-live="polite" className="inline-flex h-8 min-w-[6.5rem] items-center gap-2 text-[0.85rem] text-graphite" data-testid="explorer-busy" data-busy={busy || undefined}>
      {busy ? (
        <>
          <span aria-hidden="true" className="skeleton inline-block h-2 w-10 rounded-full bg-reference" />
          Computing…
        </>
      ) : null}
    </span>
  );
}

function SpeciesField({ value, onCommit }: { value: string; onCommit: (v: string) => void }) {
  const id = useId();
  const [text, setText] = useCommittedText(value, (v) => v, (t, v) => t.trim() === v.trim());
  return (
    <FieldShell label="Species" htmlFor={id} hint="A formula with its charge: O2, N2+, O2^2-, CO, NO+, HF" hintId={`${id}-hint`}>
      <input
        id={id}
        className={inputClass}
        value={text}
        list={`${id}-list`}
        maxLength={12}
        autoComplete="off"
        spellCheck={false}
        aria-describedby={`${id}-hint`}
        data-testid="explorer-species"
        onChange={(e) => {
          setText(e.target.value);
          if (/^[A-Za-z0-9+\-^ ]{1,12}$/.test(e.target.value)) onCommit(e.target.value);
        }}
      />
      <datalist id={`${id}-list`}>
        {SPECIES_SUGGESTIONS.map((s) => (
          <option key={s} value={s} />
        ))}
      </datalist>
    </FieldShell>
  );
}

function GraphField({ value, onCommit, errors }: { value: string; onCommit: (v: string) => void; errors: string[] | null }) {
  const id = useId();
  const [text, setText] = useCommittedText(value, (v) => v, (t, v) => t === v);
  return (
    <div className="flex min-w-0 flex-col gap-1 md:col-span-3">
      <label htmlFor={id} className="text-[0.85rem] font-semibold text-ink">
        Graph (JSON)
      </label>
      <textarea
        id={id}
        className="num min-h-[9rem] w-full rounded-[3px] border border-rule-strong bg-white px-2 py-1.5 text-[0.85rem] text-ink aria-[invalid=true]:border-antibonding"
        value={text}
        spellCheck={false}
        aria-invalid={errors ? true : undefined}
        aria-describedby={`${id}-hint${errors ? ` ${id}-errors` : ''}`}
        data-testid="explorer-graph"
        onChange={(e) => {
          setText(e.target.value);
          if (e.target.value.length <= 20_000) onCommit(e.target.value);
        }}
      />
      <p id={`${id}-hint`} className="text-[0.78rem] text-graphite">
        <code>atoms</code>: types such as "C", "N-pyridine", "O-carbonyl" (or objects with h, piElectrons, label); <code>bonds</code>: [from, to] or [from, to, k], atoms counted from 0; optional{' '}
        <code>charge</code> and <code>name</code>.
      </p>
      {errors ? (
        <div id={`${id}-errors`} role="alert" className="rounded-[3px] border border-antibonding/50 bg-sheet px-3 py-2 text-[0.85rem]" data-testid="explorer-graph-errors">
          <p className="font-semibold text-antibonding">The graph cannot be solved yet:</p>
          <ul className="list-disc pl-5 text-ink">
            {errors.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

function Controls({ state, update, graphErrors }: { state: ExplorerState; update: (change: Partial<ExplorerState>) => void; graphErrors: string[] | null }) {
  const curves = state.family === 'one-electron' || state.family === 'two-electron';
  return (
    <form
      aria-label="Model and parameters"
      className="mb-5 grid gap-x-4 gap-y-3 rounded-[3px] border border-rule bg-sheet px-4 py-3 sm:grid-cols-2 md:grid-cols-3 lg:grid-cols-6"
      onSubmit={(e) => e.preventDefault()}
      data-testid="explorer-controls"
    >
      <SelectField<ExplorerFamily>
        label="Model family"
        value={state.family}
        options={explorerFamilies.map((f) => ({ value: f, label: familyLabel[f] }))}
        onChange={(family) => update({ family })}
        className="sm:col-span-2"
        testId="explorer-family"
      />
      {state.family !== 'huckel' ? (
        <SelectField label="Distance unit" value={state.distanceUnit} options={distanceUnits.map((u) => ({ value: u, label: distanceUnitOptionLabel[u] }))} onChange={(distanceUnit) => update({ distanceUnit })} />
      ) : null}
      {curves ? (
        <SelectField label="Energy unit" value={state.energyUnit} options={energyUnits.map((u) => ({ value: u, label: energyUnitOptionLabel[u] }))} onChange={(energyUnit) => update({ energyUnit })} />
      ) : null}
      {state.family === 'one-electron' ? (
        <>
          <NumberField label="Charge Za" value={state.za} min={LIMITS.charge.min} max={LIMITS.charge.max} step={0.5} onCommit={(za) => update({ za })} />
          <NumberField label="Charge Zb" value={state.zb} min={LIMITS.charge.min} max={LIMITS.charge.max} step={0.5} onCommit={(zb) => update({ zb })} />
        </>
      ) : null}
      {curves ? (
        <>
          <NumberField
            label="Orbital exponent ζ"
            value={state.zeta === 'opt' ? 1 : state.zeta}
            disabled={state.zeta === 'opt'}
            min={LIMITS.zeta.min}
            max={LIMITS.zeta.max}
            step={0.05}
            onCommit={(zeta) => update({ zeta })}
          />
          <CheckboxField className="self-end pb-2" label="Optimize ζ at every R" checked={state.zeta === 'opt'} onChange={(on) => update({ zeta: on ? 'opt' : 1 })} />
          <NumberField label="R from" unit="a₀" value={state.rMinBohr} min={LIMITS.rBohr.min} max={LIMITS.rBohr.max} step={0.1} validate={(v) => (v < state.rMaxBohr ? null : 'R from must be below R to.')} onCommit={(rMinBohr) => update({ rMinBohr })} />
          <NumberField label="R to" unit="a₀" value={state.rMaxBohr} min={LIMITS.rBohr.min} max={LIMITS.rBohr.max} step={0.5} validate={(v) => (v > state.rMinBohr ? null : 'R to must be above R from.')} onCommit={(rMaxBohr) => update({ rMaxBohr })} />
          <NumberField label="Grid points" value={state.points} integer min={LIMITS.points.min} max={LIMITS.points.max} onCommit={(points) => update({ points })} />
        </>
      ) : null}
      {state.family === 'one-electron' ? (
        <>
          <CheckboxField className="self-end pb-2" label="Compare with the exact curves" checked={state.exact} onChange={(exact) => update({ exact })} />
          <NumberField
            label="Densities at R"
            unit="a₀"
            value={state.densityRBohr ?? 2}
            disabled={state.densityRBohr === null}
            min={LIMITS.rBohr.min}
            max={LIMITS.rBohr.max}
            step={0.1}
            onCommit={(densityRBohr) => update({ densityRBohr })}
          />
          <CheckboxField className="self-end pb-2" label="Densities at the LCAO minimum" checked={state.densityRBohr === null} onChange={(on) => update({ densityRBohr: on ? null : 2 })} />
        </>
      ) : null}
      {state.family === 'diatomic' ? (
        <>
          <SpeciesField value={state.species} onCommit={(species) => update({ species })} />
          <SelectField<LevelOrder>
            label="Level order"
            value={state.order}
            options={[
              { value: 'auto', label: 'automatic (by nuclear charge)' },
              { value: 'mixed', label: 's–p mixed (Li₂ … N₂)' },
              { value: 'unmixed', label: 'unmixed (O₂ … Ne₂)' },
            ]}
            onChange={(order) => update({ order })}
            className="sm:col-span-2"
          />
        </>
      ) : null}
      {state.family === 'huckel' ? (
        <>
          <SelectField<HuckelKind>
            label="π system"
            value={state.huckelKind}
            options={[
              { value: 'chain', label: 'linear chain (polyene)' },
              { value: 'ring', label: 'ring (annulene)' },
              { value: 'graph', label: 'any graph (JSON)' },
            ]}
            onChange={(huckelKind) => update({ huckelKind, huckelN: huckelKind === 'ring' ? Math.max(3, state.huckelN) : state.huckelN })}
          />
          {state.huckelKind !== 'graph' ? (
            <NumberField
              label="Number of atoms"
              integer
              value={state.huckelN}
              min={state.huckelKind === 'ring' ? LIMITS.huckelN.ring.min : LIMITS.huckelN.chain.min}
              max={LIMITS.huckelN.chain.max}
              onCommit={(huckelN) => update({ huckelN })}
            />
          ) : (
            <GraphField value={state.graph} onCommit={(graph) => update({ graph })} errors={graphErrors} />
          )}
        </>
      ) : null}
    </form>
  );
}

function CurveSection({ curves, units, title, caption }: { curves: CurveView; units: PlotUnits; title: string; caption: string }) {
  return (
    <section aria-label={title} className="grid gap-3">
      <CurvePlot
        title={title}
        description={curves.description}
        series={curves.series}
        units={units}
        markers={curves.markers}
        limitHartree={curves.limitHartree}
        secondPanel={curves.secondPanel}
        height={340}
        testId="explorer-curves"
      />
      <CurveAnalysisTable rows={curves.rows} units={units} caption={caption} />
      <p className="text-[0.82rem] text-graphite">
        Rₑ and E(Rₑ) are the model's own minimum (found on the model, not on the grid); Dₑ is measured against the model's dissociation limit; ωₑ is harmonic, for ¹H–¹H masses.
      </p>
    </section>
  );
}

function Results({ view, units }: { view: ExplorerView; units: PlotUnits }) {
  switch (view.kind) {
    case 'one-electron':
      return (
        <div className="grid gap-6">
          <CurveSection curves={view.curves} units={units} title="Bonding and antibonding curves" caption="Analysis of the one-electron curves" />
          <IntegralsPlot integrals={view.integrals} units={units} />
          {view.densities ? (
            <div className="grid gap-4">
              <DensityLinePlot set={view.densities} unit={units.distance} />
              <DensityPlaneMaps set={view.densities} unit={units.distance} />
            </div>
          ) : (
            <p role="alert" className="text-antibonding">
              No densities: {view.densityError}
            </p>
          )}
        </div>
      );
    case 'two-electron':
      return <CurveSection curves={view.curves} units={units} title="H₂ ground-state curves" caption="Analysis of the H₂ curves" />;
    case 'diatomic':
      return <MoDiagramView diagram={view.diagram} distanceUnit={units.distance} />;
    case 'huckel':
      return <HuckelView result={view.result} name={view.name} />;
    case 'error':
      return (
        <div role="alert" className="rounded-[3px] border border-antibonding/50 bg-sheet px-4 py-3" data-testid="explorer-error">
          <p className="font-semibold text-antibonding">{view.title}.</p>
          <ul className="list-disc pl-5 text-ink">
            {view.messages.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </div>
      );
  }
}

/**
 * /explorer: pick a model and its parameters and see its Reference computed
 * live in the browser. The URL holds the whole view (bookmark or share it);
 * heavy recomputation runs deferred so that the form stays responsive.
 */
export function ExplorerPage() {
  const [params, setParams] = useSearchParams();
  const { state } = useMemo(() => parseExplorerState(params), [params]);
  const key = computeKey(params);
  const deferredKey = useDeferredValue(key);
  const busy = key !== deferredKey;
  const view = useMemo(() => computeExplorerView(parseExplorerState(new URLSearchParams(deferredKey)).state), [deferredKey]);
  const units: PlotUnits = { distance: state.distanceUnit, energy: state.energyUnit };

  const update = useCallback(
    (change: Partial<ExplorerState>) => {
      setParams(explorerSearchParams({ ...state, ...change }), { replace: true, preventScrollReset: true });
    },
    [setParams, state],
  );

  const graphErrors = state.family === 'huckel' && state.huckelKind === 'graph' && view.kind === 'error' ? view.messages : null;

  return (
    <>
      <title>Reference explorer · Bondmark</title>
      <PageHeader
        title="Reference explorer"
        description="Any model's reference, computed in your browser: curves, integrals, densities, MO diagrams and Hückel levels. The address holds the view, so a bookmark brings it back."
        actions={<Busy busy={busy} />}
      />
      <Controls state={state} update={update} graphErrors={graphErrors} />
      <div className={busy ? 'opacity-70 transition-opacity' : undefined} aria-busy={busy || undefined} data-testid="explorer-results" data-family={view.kind}>
        {graphErrors ? null : <Results view={view} units={units} />}
      </div>
    </>
  );
}
