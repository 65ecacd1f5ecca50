/**
 * The marking-scheme editor: the checks that apply to the model family, each
 * with its label, weight (shown as a share of the total), tolerances in the
 * check's unit and partial-credit rule; manual items marked by hand.
 */
import { useId, useState } from 'react';
import { checksByFamily, type CheckKind, type ModelFamily } from '@shared/exercises/spec';
import { Button } from '@client/components/ui/button';
import { Num } from '@client/components/ui/num';
import type { IssueMap } from '../lib/form-issues';
import { checkKindLabel, checkUnitLabel, newCheck, type CheckInput } from '../lib/spec-defaults';
import { weightPercentages } from '../lib/weights';
import { FieldShell, NumberField, SelectField, TextField, inputClasses } from './fields';

const hasTolerance = (c: CheckInput): c is Extract<CheckInput, { full: number }> => 'full' in c;

export function SchemeEditor({ family, checks, onChange, issues }: { family: ModelFamily; checks: CheckInput[]; onChange: (c: CheckInput[]) => void; issues: IssueMap }) {
  const allowed = checksByFamily[family];
  const [adding, setAdding] = useState<CheckKind>(allowed[0]);
  const addId = useId();
  const kindToAdd = allowed.includes(adding) ? adding : allowed[0];
  const shares = weightPercentages(checks.map((c) => c.weight ?? 0));
  const total = checks.reduce((a, c) => a + (Number.isFinite(c.weight) ? (c.weight ?? 0) : 0), 0);
  const set = (i: number, c: CheckInput) => onChange(checks.map((x, j) => (j === i ? c : x)));
  const schemeError = issues.get('scheme.checks') ?? issues.get('scheme');

  return (
    <div className="grid gap-3" data-testid="scheme-editor">
      {schemeError ? (
        <p className="text-[0.85rem] font-semibold text-antibonding" data-testid="field-error">
          {schemeError}
        </p>
      ) : null}
      <ol className="grid gap-2">
        {checks.map((c, i) => {
          const path = `scheme.checks.${i}`;
          const unit = checkUnitLabel[c.kind];
          return (
            <li key={i} className="rounded-[3px] border border-rule bg-white/60 p-3" data-testid="scheme-check" data-check-kind={c.kind}>
              <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
                <p className="font-semibold text-ink">
                  {checkKindLabel[c.kind]}
                  {!allowed.includes(c.kind) ? <span className="ml-2 text-antibonding">does not apply to this model</span> : null}
                </p>
                <p className="text-sm text-graphite">
                  <span data-testid="check-share">
                    <Num className="font-semibold text-ink">{shares[i].toFixed(1)} %</Num>
                  </span>{' '}
                  of the mark
                </p>
              </div>
              {issues.get(`${path}.kind`) ? <p className="mb-2 text-[0.85rem] font-semibold text-antibonding">{issues.get(`${path}.kind`)}</p> : null}
              <div className="grid gap-2 sm:grid-cols-[minmax(0,2fr)_minmax(0,1fr)_7rem]">
                <TextField path={`${path}.label`} label="Label" issues={issues} value={c.label} onChange={(label) => set(i, { ...c, label })} />
                <TextField path={`${path}.id`} label="Check id" issues={issues} value={c.id} onChange={(id) => set(i, { ...c, id })} />
                <NumberField path={`${path}.weight`} label="Weight" issues={issues} value={c.weight} onChange={(weight) => set(i, { ...c, weight })} />
              </div>
              {hasTolerance(c) ? (
                <div className="mt-2 grid gap-2 sm:grid-cols-3">
                  <NumberField path={`${path}.full`} label="Full points up to" unit={unit} issues={issues} value={c.full} onChange={(full) => set(i, { ...c, full })} />
                  <NumberField path={`${path}.zero`} label="No points from" unit={unit} issues={issues} value={c.zero} onChange={(zero) => set(i, { ...c, zero })} />
                  <SelectField
                    path={`${path}.credit`}
                    label="In between"
                    issues={issues}
                    value={c.credit ?? 'linear'}
                    onChange={(credit) => set(i, { ...c, credit })}
                    options={[
                      ['linear', 'Partial credit, linear'],
                      ['all-or-nothing', 'All or nothing (full tolerance)'],
                    ]}
                  />
                </div>
              ) : null}
              {c.kind === 'curve-rms' || c.kind === 'curve-max' ? (
                <label className="mt-2 inline-flex items-center gap-2 text-sm">
                  <input type="checkbox" className="size-4 accent-reference" checked={Boolean(c.removeShift)} onChange={(e) => set(i, { ...c, removeShift: e.target.checked })} />
                  Ignore a constant energy shift (compare shapes)
                </label>
              ) : null}
              {c.kind === 'vibrational-wavenumber' ? (
                <div className="mt-2 grid gap-2 sm:grid-cols-2">
                  {[0, 1].map((k) => (
                    <TextField
                      key={k}
                      path={`${path}.isotopes`}
                      label={`Isotope ${k === 0 ? 'A' : 'B'}`}
                      hint={k === 0 ? 'e.g. 1H, 2H; empty for ¹H–¹H' : undefined}
                      issues={k === 0 ? issues : new Map()}
                      value={c.isotopes?.[k] ?? ''}
                      onChange={(v) => {
                        const iso: [string, string] = [c.isotopes?.[0] ?? '1H', c.isotopes?.[1] ?? '1H'];
                        iso[k] = v.trim();
                        set(i, { ...c, isotopes: iso[0] || iso[1] ? iso : undefined });
                      }}
                    />
                  ))}
                </div>
              ) : null}
              {c.kind === 'manual' ? (
                <FieldShell path={`${path}.description`} label="What the marker looks for" issues={issues} className="mt-2">
                  {(a11y) => <textarea {...a11y} rows={2} value={c.description ?? ''} onChange={(e) => set(i, { ...c, description: e.target.value })} className={`${inputClasses} h-auto py-1.5`} />}
                </FieldShell>
              ) : null}
              <div className="mt-2 text-right">
                <Button size="sm" variant="quiet" onClick={() => onChange(checks.filter((_, j) => j !== i))} aria-label={`Remove check ${c.label || checkKindLabel[c.kind]}`}>
                  Remove check
                </Button>
              </div>
            </li>
          );
        })}
      </ol>
      <div className="flex flex-wrap items-end justify-between gap-3 border-t border-rule pt-3">
        <div className="flex items-end gap-2">
          <div className="flex flex-col">
            <label htmlFor={addId} className="mb-1 text-sm font-semibold text-ink">
              Check to add
            </label>
            <select id={addId} value={kindToAdd} onChange={(e) => setAdding(e.target.value as CheckKind)} className={inputClasses}>
              {allowed.map((k) => (
                <option key={k} value={k}>
                  {checkKindLabel[k]}
                </option>
              ))}
            </select>
          </div>
          <Button onClick={() => onChange([...checks, newCheck(kindToAdd, checks.map((c) => c.id))])}>Add check</Button>
        </div>
        <p className="text-sm text-graphite" data-testid="scheme-total">
          Total weight <Num className="font-semibold text-ink">{Number.isFinite(total) ? total : '—'}</Num> ={' '}
          <Num className="font-semibold text-ink">{total > 0 ? shares.reduce((a, b) => a + b, 0).toFixed(1) : '0.0'} %</Num>
        </p>
      </div>
    </div>
  );
}
