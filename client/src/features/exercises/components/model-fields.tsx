/**
 * The model part of the editor: family, method and fixed parameters, and the
 * rules by which each student's variant is drawn (fixed / range / list for
 * Za, Zb and ζ; a species list; Hückel systems), plus the R grid.
 */
import { choiceValues, gridValues } from '@shared/exercises/variants';
import { distanceUnits } from '@shared/chemistry/units';
import type { ExerciseSpecInput, ModelFamily, NumberChoice } from '@shared/exercises/spec';
import { Button } from '@client/components/ui/button';
import { Num } from '@client/components/ui/num';
import { distanceUnitOptionLabel } from '@client/features/explorer/lib/units';
import type { IssueMap } from '../lib/form-issues';
import { familyLabel, methodLabel, type ModelInput } from '../lib/spec-defaults';
import { FieldShell, NumberField, NumberListField, SelectField, TextField, inputClasses } from './fields';

type Choice = NumberChoice | { kind: 'optimized' };
type ChoiceKind = Choice['kind'];

const choiceKindLabels: Record<ChoiceKind, string> = { fixed: 'Same for everyone', range: 'Drawn from a range', list: 'Drawn from a list', optimized: 'Optimized at every R' };

function convertChoice(from: Choice, kind: ChoiceKind): Choice {
  const first = from.kind === 'fixed' ? from.value : from.kind === 'range' ? from.min : from.kind === 'list' ? (from.values[0] ?? 1) : 1;
  if (kind === 'fixed') return { kind, value: first };
  if (kind === 'range') return { kind, min: first, max: first + 0.3, step: 0.1 };
  if (kind === 'list') return { kind, values: [first] };
  return { kind: 'optimized' };
}

function countOf(choice: Choice): number | null {
  try {
    return choice.kind === 'optimized' ? 1 : choiceValues(choice).length;
  } catch {
    return null;
  }
}

export function NumberChoiceField({
  path,
  label,
  value,
  onChange,
  issues,
  allowOptimized = false,
}: {
  path: string;
  label: string;
  value: Choice;
  onChange: (v: Choice) => void;
  issues: IssueMap;
  allowOptimized?: boolean;
}) {
  const kinds: ChoiceKind[] = allowOptimized ? ['fixed', 'range', 'list', 'optimized'] : ['fixed', 'range', 'list'];
  const n = countOf(value);
  return (
    <div className="grid gap-2 rounded-[3px] border border-rule bg-white/60 p-3 sm:grid-cols-[14rem_minmax(0,1fr)]" data-choice={path}>
      <SelectField
        path={`${path}.kind`}
        label={label}
        issues={issues}
        value={value.kind}
        onChange={(k) => onChange(convertChoice(value, k))}
        options={kinds.map((k) => [k, choiceKindLabels[k]] as const)}
        hint={n !== null && value.kind !== 'fixed' && value.kind !== 'optimized' ? `${n} possible value${n === 1 ? '' : 's'}` : undefined}
      />
      <div className="grid grid-cols-3 gap-2 self-start">
        {value.kind === 'fixed' ? (
          <NumberField path={`${path}.value`} label={`${label} value`} issues={issues} value={value.value} onChange={(v) => onChange({ ...value, value: v })} />
        ) : value.kind === 'range' ? (
          <>
            <NumberField path={`${path}.min`} label="From" issues={issues} value={value.min} onChange={(v) => onChange({ ...value, min: v })} />
            <NumberField path={`${path}.max`} label="To" issues={issues} value={value.max} onChange={(v) => onChange({ ...value, max: v })} />
            <NumberField path={`${path}.step`} label="Step" issues={issues} value={value.step} onChange={(v) => onChange({ ...value, step: v })} />
          </>
        ) : value.kind === 'list' ? (
          <NumberListField
            className="col-span-3"
            path={`${path}.values`}
            label={`${label} values`}
            hint="Separate values with commas."
            issues={issues}
            value={value.values}
            onChange={(v) => onChange({ ...value, values: v })}
          />
        ) : (
          <p className="col-span-3 pt-6 text-sm text-graphite">The exponent is varied at every R to give the lowest energy.</p>
        )}
      </div>
    </div>
  );
}

function GridFields({ grid, onChange, issues }: { grid: Extract<ModelInput, { grid: unknown }>['grid']; onChange: (g: typeof grid) => void; issues: IssueMap }) {
  let points: number | null = null;
  try {
    points = grid.end > grid.start && grid.step > 0 ? gridValues(grid).length : null;
  } catch {
    points = null;
  }
  return (
    <div className="grid gap-2 sm:grid-cols-4">
      <SelectField
        path="model.grid.unit"
        label="R grid unit"
        issues={issues}
        value={grid.unit}
        onChange={(unit) => onChange({ ...grid, unit })}
        options={distanceUnits.map((u) => [u, distanceUnitOptionLabel[u]] as const)}
      />
      <NumberField path="model.grid.start" label="R from" issues={issues} value={grid.start} onChange={(start) => onChange({ ...grid, start })} />
      <NumberField path="model.grid.end" label="R to" issues={issues} value={grid.end} onChange={(end) => onChange({ ...grid, end })} />
      <NumberField
        path="model.grid.step"
        label="R step"
        issues={issues}
        value={grid.step}
        onChange={(step) => onChange({ ...grid, step })}
        hint={points !== null ? <><Num>{points}</Num> points</> : undefined}
      />
    </div>
  );
}

function SpeciesField({ species, onChange, issues }: { species: string[]; onChange: (s: string[]) => void; issues: IssueMap }) {
  const listIssue = [...issues.entries()].find(([k]) => k.startsWith('model.species.'));
  const withItem = new Map(issues);
  if (listIssue && !issues.has('model.species')) {
    const index = Number(listIssue[0].split('.')[2]);
    withItem.set('model.species', `${species[index] ?? `item ${index + 1}`}: ${listIssue[1]}`);
  }
  return (
    <TextField
      path="model.species"
      label="Species drawn from"
      hint="Formulas separated by commas, with an optional charge: O2, N2, O2+, B2, C2, F2, CO, NO+"
      issues={withItem}
      value={species.join(', ')}
      onChange={(v) => onChange(v.split(',').map((s) => s.trim()).filter(Boolean))}
    />
  );
}

type HuckelSystemInput = Extract<ModelInput, { family: 'huckel' }>['systems'][number];

function HuckelSystemsField({ systems, onChange, issues }: { systems: HuckelSystemInput[]; onChange: (s: HuckelSystemInput[]) => void; issues: IssueMap }) {
  const set = (i: number, s: HuckelSystemInput) => onChange(systems.map((x, j) => (j === i ? s : x)));
  return (
    <div className="grid gap-2" data-testid="huckel-systems">
      <p className="text-sm font-semibold text-ink">Pi systems drawn from</p>
      {issues.get('model.systems') ? <p className="text-[0.85rem] font-semibold text-antibonding">{issues.get('model.systems')}</p> : null}
      <ol className="grid gap-2">
        {systems.map((s, i) => (
          <li key={i} className="grid items-end gap-2 rounded-[3px] border border-rule bg-white/60 p-2 sm:grid-cols-[10rem_minmax(0,1fr)_auto]">
            <SelectField
              path={`model.systems.${i}.kind`}
              label={`System ${i + 1}`}
              issues={issues}
              value={s.kind}
              onChange={(kind) => set(i, kind === 'graph' ? { kind, name: 'my molecule', graph: { atoms: ['C', 'C', 'C', 'C'], bonds: [[0, 1], [1, 2], [2, 3]] } } : { kind, n: s.kind === 'graph' ? 4 : s.n })}
              options={[
                ['chain', 'Chain'],
                ['ring', 'Ring'],
                ['graph', 'Any graph (JSON)'],
              ]}
            />
            {s.kind === 'graph' ? (
              <div className="grid gap-2">
                <TextField path={`model.systems.${i}.name`} label="Name" issues={issues} value={s.name} onChange={(name) => set(i, { ...s, name })} />
                <GraphJsonField path={`model.systems.${i}.graph`} value={s.graph} onChange={(graph) => set(i, { ...s, graph })} issues={issues} />
              </div>
            ) : (
              <NumberField path={`model.systems.${i}.n`} label="Atoms in the pi system" issues={issues} value={s.n} onChange={(n) => set(i, { ...s, n })} />
            )}
            <Button size="sm" variant="quiet" aria-label={`Remove system ${i + 1}`} disabled={systems.length <= 1} onClick={() => onChange(systems.filter((_, j) => j !== i))}>
              Remove
            </Button>
          </li>
        ))}
      </ol>
      <div>
        <Button size="sm" onClick={() => onChange([...systems, { kind: 'chain', n: 4 }])}>
          Add a pi system
        </Button>
      </div>
    </div>
  );
}

function GraphJsonField({ path, value, onChange, issues }: { path: string; value: unknown; onChange: (v: unknown) => void; issues: IssueMap }) {
  const local = new Map(issues);
  return (
    <FieldShell path={path} label="Atoms and bonds (JSON)" issues={local} hint='e.g. {"atoms": ["C","C","N-pyridine"], "bonds": [[0,1],[1,2],[2,0]]}'>
      {(a11y) => (
        <textarea
          {...a11y}
          rows={3}
          defaultValue={JSON.stringify(value)}
          onChange={(e) => {
            try {
              onChange(JSON.parse(e.target.value));
            } catch {
              onChange(e.target.value);
            }
          }}
          className={`${inputClasses} num h-auto py-1.5`}
        />
      )}
    </FieldShell>
  );
}

export function ModelFields({
  model,
  onModel,
  onFamily,
  issues,
}: {
  model: ModelInput;
  onModel: (m: ModelInput) => void;
  onFamily: (f: ModelFamily) => void;
  issues: IssueMap;
}) {
  return (
    <div className="grid gap-3">
      <div className="grid gap-2 sm:grid-cols-2">
        <SelectField
          path="model.family"
          label="Model"
          issues={issues}
          value={model.family}
          onChange={onFamily}
          options={(Object.keys(familyLabel) as ModelFamily[]).map((f) => [f, familyLabel[f]] as const)}
        />
        {model.family === 'one-electron' ? (
          <SelectField path="model.method" label="Method" issues={issues} value={model.method} onChange={(method) => onModel({ ...model, method })} options={(['lcao', 'exact'] as const).map((m) => [m, methodLabel[m]] as const)} />
        ) : model.family === 'two-electron' ? (
          <SelectField path="model.method" label="Method" issues={issues} value={model.method} onChange={(method) => onModel({ ...model, method })} options={(['mo', 'ci', 'vb'] as const).map((m) => [m, methodLabel[m]] as const)} />
        ) : model.family === 'diatomic' ? (
          <SelectField
            path="model.order"
            label="Level order"
            issues={issues}
            value={model.order}
            onChange={(order) => onModel({ ...model, order })}
            options={[
              ['auto', 'By the species (s–p mixing up to N₂)'],
              ['mixed', 'With s–p mixing (πu below 3σg)'],
              ['unmixed', 'Without s–p mixing (3σg below πu)'],
            ]}
          />
        ) : null}
      </div>

      {model.family === 'one-electron' ? (
        <>
          <NumberChoiceField path="model.za" label="Za" value={model.za} onChange={(za) => onModel({ ...model, za: za as NumberChoice })} issues={issues} />
          <NumberChoiceField path="model.zb" label="Zb" value={model.zb} onChange={(zb) => onModel({ ...model, zb: zb as NumberChoice })} issues={issues} />
          {model.method === 'lcao' ? <NumberChoiceField path="model.zeta" label="ζ" value={model.zeta} onChange={(zeta) => onModel({ ...model, zeta })} issues={issues} allowOptimized /> : null}
          <StatesField states={model.states} onChange={(states) => onModel({ ...model, states })} issues={issues} />
          <GridFields grid={model.grid} onChange={(grid) => onModel({ ...model, grid })} issues={issues} />
        </>
      ) : model.family === 'two-electron' ? (
        <>
          <NumberChoiceField path="model.zeta" label="ζ" value={model.zeta} onChange={(zeta) => onModel({ ...model, zeta })} issues={issues} allowOptimized />
          <GridFields grid={model.grid} onChange={(grid) => onModel({ ...model, grid })} issues={issues} />
        </>
      ) : model.family === 'diatomic' ? (
        <SpeciesField species={model.species} onChange={(species) => onModel({ ...model, species })} issues={issues} />
      ) : (
        <HuckelSystemsField systems={model.systems} onChange={(systems) => onModel({ ...model, systems })} issues={issues} />
      )}
    </div>
  );
}

function StatesField({ states, onChange, issues }: { states: ('bonding' | 'antibonding')[]; onChange: (s: ('bonding' | 'antibonding')[]) => void; issues: IssueMap }) {
  const error = issues.get('model.states');
  const toggle = (s: 'bonding' | 'antibonding', on: boolean) => onChange((['bonding', 'antibonding'] as const).filter((x) => (x === s ? on : states.includes(x))));
  return (
    <fieldset className="min-w-0" aria-describedby={error ? 'states-error' : undefined} data-field="model.states">
      <legend className="mb-1 text-sm font-semibold text-ink">States students compute</legend>
      <div className="flex flex-wrap gap-4">
        {(['bonding', 'antibonding'] as const).map((s) => (
          <label key={s} className="inline-flex items-center gap-2">
            <input type="checkbox" checked={states.includes(s)} onChange={(e) => toggle(s, e.target.checked)} className="size-4 accent-reference" />
            {s === 'bonding' ? 'Bonding (lower)' : 'Antibonding (upper)'}
          </label>
        ))}
      </div>
      {error ? (
        <p id="states-error" className="mt-0.5 text-[0.85rem] font-semibold text-antibonding" data-testid="field-error">
          {error}
        </p>
      ) : null}
    </fieldset>
  );
}

export type { ExerciseSpecInput };
