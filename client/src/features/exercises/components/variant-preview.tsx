/**
 * Live preview inside the editor: any variant's Reference (curves, MO
 * diagram or Hückel levels, computed in the browser by ReferencePreview), a
 * lookup of one student's variant, and the answer key of every variant.
 */
import { useDeferredValue, useId, useMemo, useState } from 'react';
import { answerKeyOf } from '@shared/api/exercises';
import type { ModelSpec } from '@shared/exercises/spec';
import { computeReference } from '@shared/exercises/reference';
import { allVariants, drawVariant, type Variant } from '@shared/exercises/variants';
import { energyUnits, type EnergyUnit } from '@shared/chemistry/units';
import { Button } from '@client/components/ui/button';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { ReferencePreview } from '@client/features/explorer';
import { energyUnitOptionLabel } from '@client/features/explorer/lib/units';
import { useAnswerKey, usePreview } from '../api/get-exercise';
import { AnswerKeyTable, variantLabel, type AnswerKeyRow } from './answer-key-table';
import { inputClasses } from './fields';

const CLIENT_KEY_CAP = 60;

function clientRows(model: ModelSpec, variants: Variant[]): AnswerKeyRow[] {
  return variants.slice(0, CLIENT_KEY_CAP).map((variant) => {
    try {
      return { key: variant.key, variant, answers: answerKeyOf(computeReference(model, variant)), error: null };
    } catch (e) {
      return { key: variant.key, variant, answers: null, error: (e as Error).message };
    }
  });
}

export function VariantPreviewPanel({
  model,
  seed,
  exerciseId,
  saved,
  showStudents,
}: {
  /** the parsed model of the form, or null while the form has errors */
  model: ModelSpec | null;
  seed: string;
  /** the saved exercise, when there is one */
  exerciseId?: number;
  /** the form equals the saved exercise (then the server's stored variants and students apply) */
  saved: boolean;
  showStudents: boolean;
}) {
  const deferredModel = useDeferredValue(model);
  const variants = useMemo(() => (deferredModel ? allVariants(deferredModel, 501) : []), [deferredModel]);
  const [picked, setPicked] = useState<Variant | null>(null);
  const [studentInput, setStudentInput] = useState('');
  const [studentNumber, setStudentNumber] = useState('');
  const [energyUnit, setEnergyUnit] = useState<EnergyUnit>('hartree');
  const studentId = useId();
  const unitId = useId();
  const variantId = useId();

  const server = saved && exerciseId !== undefined;
  const preview = usePreview(exerciseId ?? 0, studentNumber, server);
  const answerKey = useAnswerKey(exerciseId ?? 0, server);

  const studentVariant: Variant | null =
    studentNumber && deferredModel ? (server ? (preview.data?.variant ?? null) : drawVariant(deferredModel, seed, studentNumber)) : null;
  const current = (() => {
    const wanted = studentVariant ?? picked;
    if (wanted && wanted.family === deferredModel?.family) return wanted;
    return variants[0] ?? null;
  })();

  const rows: AnswerKeyRow[] = useMemo(() => {
    if (server && answerKey.data) return answerKey.data.variants;
    return deferredModel ? clientRows(deferredModel, variants) : [];
  }, [server, answerKey.data, deferredModel, variants]);

  if (!model || !deferredModel) {
    return <p className="text-graphite" data-testid="preview-waiting">The preview appears once the model and its variant rules are valid.</p>;
  }

  return (
    <div className="grid gap-4" data-testid="variant-preview">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-[14rem] flex-col">
          <label htmlFor={variantId} className="mb-1 text-sm font-semibold text-ink">
            Variant to preview
          </label>
          <select
            id={variantId}
            className={inputClasses}
            value={current?.key ?? ''}
            onChange={(e) => {
              setStudentNumber('');
              setPicked(variants.find((v) => v.key === e.target.value) ?? null);
            }}
          >
            {variants.slice(0, 500).map((v) => (
              <option key={v.key} value={v.key}>
                {variantLabel(v)}
              </option>
            ))}
            {current && !variants.some((v) => v.key === current.key) ? <option value={current.key}>{variantLabel(current)}</option> : null}
          </select>
        </div>
        <form
          className="flex items-end gap-2"
          onSubmit={(e) => {
            e.preventDefault();
            setStudentNumber(studentInput.trim());
          }}
        >
          <div className="flex flex-col">
            <label htmlFor={studentId} className="mb-1 text-sm font-semibold text-ink">
              Student number
            </label>
            <input id={studentId} className={`${inputClasses} num w-[11rem]`} value={studentInput} onChange={(e) => setStudentInput(e.target.value)} autoComplete="off" />
          </div>
          <Button type="submit">Show their variant</Button>
        </form>
        {deferredModel.family === 'one-electron' || deferredModel.family === 'two-electron' ? (
        <div className="flex flex-col">
          <label htmlFor={unitId} className="mb-1 text-sm font-semibold text-ink">
            Energy unit
          </label>
          <select id={unitId} className={inputClasses} value={energyUnit} onChange={(e) => setEnergyUnit(e.target.value as EnergyUnit)}>
            {energyUnits.map((u) => (
              <option key={u} value={u}>
                {energyUnitOptionLabel[u]}
              </option>
            ))}
          </select>
        </div>
        ) : null}
      </div>
      {studentNumber ? (
        <p className="text-sm text-graphite" data-testid="student-variant-note">
          {server ? (
            preview.isPending ? (
              'Looking up the student…'
            ) : preview.isError ? (
              <span className="text-antibonding">{(preview.error as Error).message}</span>
            ) : (
              <>
                <Num>{preview.data!.student.studentNumber}</Num> {preview.data!.student.name}: {variantLabel(preview.data!.variant)}{' '}
                {preview.data!.stored ? `(stored with revision ${preview.data!.revisionNo})` : '(drawn from the seed; stored at publication)'}
              </>
            )
          ) : (
            <>
              Student <Num>{studentNumber}</Num> would get {studentVariant ? variantLabel(studentVariant) : '—'} under the rules as edited (drawn from the seed; save to check the roster).
            </>
          )}
        </p>
      ) : null}
      {current ? <ReferencePreview model={deferredModel} variant={current} energyUnit={energyUnit} /> : null}

      <section aria-labelledby="answer-key-heading" className="grid gap-2">
        <h3 id="answer-key-heading" className="font-serif text-lg font-semibold text-ink">
          Answer key of every variant
        </h3>
        <p className="text-sm text-graphite">
          {server
            ? 'Computed by the server for the saved revision, with the students holding each variant.'
            : variants.length > CLIENT_KEY_CAP
              ? `The first ${CLIENT_KEY_CAP} of ${variants.length > 500 ? 'more than 500' : variants.length} variants, computed in the browser from the rules as edited; save to see them all.`
              : 'Computed in the browser from the rules as edited.'}
        </p>
        {server && answerKey.data && !answerKey.data.complete ? (
          <p className="flex flex-wrap items-center gap-2 text-sm text-caution" data-testid="answer-key-incomplete">
            Some answer keys take long to compute and are not done yet.
            <Button size="sm" onClick={() => void answerKey.refetch()} disabled={answerKey.isFetching}>
              {answerKey.isFetching ? 'Computing…' : 'Compute the rest'}
            </Button>
          </p>
        ) : null}
        {server && answerKey.isError ? (
          <ErrorNotice what="the answer key" error={answerKey.error} onRetry={() => void answerKey.refetch()} />
        ) : server && answerKey.isPending ? (
          <p className="text-graphite" role="status">
            Computing the answer key…
          </p>
        ) : (
          <AnswerKeyTable rows={rows} selectedKey={current?.key} onPick={(v) => { setStudentNumber(''); setPicked(v); }} showStudents={showStudents && server} />
        )}
      </section>
    </div>
  );
}
