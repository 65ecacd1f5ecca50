/**
 * The exercise editor: one form driven by the shared ExerciseSpec schema
 * (plus the engine's checks), messages beside each field, the marking
 * scheme, a live preview of any variant's Reference and the answer key; for
 * a saved exercise the state changes (publish, close, reopen) with their
 * confirmations, and saving a published one asks before re-marking and then
 * shows the re-marking job's progress.
 */
import { useEffect, useMemo, useRef, useState } from 'react';
import { checkedExerciseSpecSchema, exerciseSpecEngineIssues, remarkConfirmationDetailsSchema, type ExerciseMutationResponse, type StaffExercise } from '@shared/api/exercises';
import { modelSpecSchema, uploadFileTypes, type ExerciseSpecInput, type ModelSpec } from '@shared/exercises/spec';
import { Button } from '@client/components/ui/button';
import { ConfirmDialog } from '@client/components/ui/confirm-dialog';
import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { isApiError } from '@client/lib/api';
import { JobProgress } from '@client/features/reports/components/job-progress';
import { useCreateExercise, useExerciseTransition, useUpdateExercise } from '../api/mutations';
import { fieldId, issuesFromDetails, issuesFromZod, type IssueMap } from '../lib/form-issues';
import { switchFamily, timeZoneOptions } from '../lib/spec-defaults';
import { formatDueLocal } from '../lib/due';
import { FieldShell, Fieldset, NumberField, SelectField, TextField, inputClasses } from './fields';
import { MarkdownField } from './markdown-field';
import { ModelFields } from './model-fields';
import { SchemeEditor } from './scheme-editor';
import { VariantPreviewPanel } from './variant-preview';

const stateTone = { draft: 'neutral', published: 'good', closed: 'caution' } as const;
export const stateLabel = { draft: 'Draft', published: 'Published', closed: 'Closed' } as const;

/** Jumps to the control of a path, or of its nearest parent that has one (e.g. model.species.2 → model.species). */
function focusField(event: { preventDefault(): void }, path: string) {
  const parts = path.split('.');
  while (parts.length) {
    const el = document.getElementById(fieldId(parts.join('.'))) ?? document.querySelector<HTMLElement>(`[data-field="${parts.join('.')}"] input, [data-field="${parts.join('.')}"] select`);
    if (el) {
      event.preventDefault();
      el.scrollIntoView({ block: 'center' });
      el.focus();
      return;
    }
    parts.pop();
  }
}

type Pending = { kind: 'remark'; nextRevisionNo: number; reportCount: number } | { kind: 'publish' } | { kind: 'close' } | { kind: 'reopen' } | null;

export function ExerciseEditor({
  initial,
  courseId,
  exercise,
  onCreated,
}: {
  initial: ExerciseSpecInput;
  courseId: number;
  exercise?: StaffExercise;
  onCreated?: (r: ExerciseMutationResponse) => void;
}) {
  const [spec, setSpec] = useState<ExerciseSpecInput>(initial);
  const [showErrors, setShowErrors] = useState(false);
  const [serverIssues, setServerIssues] = useState<IssueMap>(new Map());
  const [pending, setPending] = useState<Pending>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [failure, setFailure] = useState<string | null>(null);
  /** the re-marking job queued by the last save, followed until it is done */
  const [remarkJobId, setRemarkJobId] = useState<number | null>(null);
  const summaryRef = useRef<HTMLDivElement>(null);
  const readOnly = exercise ? !exercise.permissions.author : false;

  const create = useCreateExercise(courseId);
  const update = useUpdateExercise(exercise?.id ?? 0);
  const transition = useExerciseTransition(exercise?.id ?? 0);
  const busy = create.isPending || update.isPending || transition.isPending;

  // a newer saved version (after save or publish) becomes the form's starting point
  const savedJson = exercise ? JSON.stringify(exercise.spec) : null;
  useEffect(() => {
    if (exercise) setSpec(exercise.spec);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [savedJson]);

  const parsed = useMemo(() => checkedExerciseSpecSchema.safeParse(spec), [spec]);
  const clientIssues = useMemo(() => issuesFromZod(parsed.success ? undefined : parsed.error), [parsed]);
  const issues: IssueMap = useMemo(() => new Map([...(showErrors ? clientIssues : []), ...serverIssues]), [showErrors, clientIssues, serverIssues]);
  const dirty = !exercise || !parsed.success || JSON.stringify(parsed.data) !== savedJson;

  const change = (next: ExerciseSpecInput) => {
    setSpec(next);
    setServerIssues(new Map());
    setNotice(null);
  };
  const set = <K extends keyof ExerciseSpecInput>(key: K, value: ExerciseSpecInput[K]) => change({ ...spec, [key]: value });

  function handleError(error: unknown) {
    if (isApiError(error) && error.code === 'validation_failed') {
      setServerIssues(issuesFromDetails(error.details));
      setShowErrors(true);
      setFailure(error.message);
      requestAnimationFrame(() => summaryRef.current?.focus());
      return;
    }
    setFailure(error instanceof Error ? error.message : 'Saving failed.');
  }

  function save(remark = false) {
    setFailure(null);
    setNotice(null);
    if (!parsed.success) {
      setShowErrors(true);
      requestAnimationFrame(() => summaryRef.current?.focus());
      return;
    }
    if (!exercise) {
      create.mutate(parsed.data, { onSuccess: (r) => onCreated?.(r), onError: handleError });
      return;
    }
    update.mutate(
      { spec: parsed.data, remark },
      {
        onSuccess: (r) => {
          setPending(null);
          setRemarkJobId(r.remarkJobId ?? null);
          setNotice(
            r.unchanged
              ? 'Nothing had changed.'
              : r.remarkJobId
                ? `Saved as revision ${r.exercise.revision.revisionNo}; re-marking of the reports is queued.`
                : 'Saved.',
          );
        },
        onError: (error) => {
          const details = isApiError(error) && error.status === 409 ? remarkConfirmationDetailsSchema.safeParse(error.details) : null;
          if (details?.success) {
            setPending({ kind: 'remark', nextRevisionNo: details.data.nextRevisionNo, reportCount: details.data.reportCount });
            return;
          }
          setPending(null);
          handleError(error);
        },
      },
    );
  }

  function runTransition(to: 'publish' | 'close', done: string) {
    setFailure(null);
    transition.mutate(to, {
      onSuccess: (r) => {
        setPending(null);
        setNotice(r.variantsDrawn ? `${done} ${r.variantsDrawn} variant${r.variantsDrawn === 1 ? '' : 's'} drawn.` : done);
      },
      onError: (e) => {
        setPending(null);
        setFailure(e instanceof Error ? e.message : 'That did not work.');
      },
    });
  }

  const errorList = [...issues.entries()];
  const zones = useMemo(() => timeZoneOptions(spec.timeZone ?? 'Europe/London'), [spec.timeZone]);
  // the preview needs only a valid model (a missing title must not hide it)
  const parsedModel = useMemo((): ModelSpec | null => {
    const m = modelSpecSchema.safeParse(spec.model);
    return m.success && exerciseSpecEngineIssues({ model: m.data, scheme: { checks: [] } }).length === 0 ? m.data : null;
  }, [spec.model]);
  const counts = exercise?.counts;

  return (
    <div className="grid gap-5">
      {exercise ? (
        <section aria-label="State" className="flex flex-wrap items-center justify-between gap-3 rounded-[3px] border border-rule bg-sheet px-4 py-3" data-testid="exercise-state-bar">
          <div className="flex flex-wrap items-center gap-x-5 gap-y-1">
            <span data-testid="exercise-state">
              <StatusText tone={stateTone[exercise.state]}>{stateLabel[exercise.state]}</StatusText>
            </span>
            <span className="text-sm text-graphite">
              Revision <Num className="text-ink">{exercise.revision.revisionNo}</Num>
              {exercise.revision.publishedAt ? ' (frozen)' : ' (editable draft)'}
            </span>
            <span className="text-sm text-graphite">
              Due <Num className="text-ink">{formatDueLocal(exercise.spec.dueLocal, exercise.spec.timeZone, exercise.dueAt)}</Num>
            </span>
            {counts ? (
              <span className="text-sm text-graphite">
                Variants <Num className="text-ink">{counts.withVariant}</Num> of <Num className="text-ink">{counts.students}</Num> students ·{' '}
                <Num className="text-ink">{counts.distinctVariants}</Num> distinct · <Num className="text-ink">{counts.reported}</Num> handed in
              </span>
            ) : null}
          </div>
          {!readOnly ? (
            <div className="flex flex-wrap gap-2">
              {exercise.state === 'draft' ? (
                <Button variant="primary" disabled={busy || dirty} title={dirty ? 'Save the changes first' : undefined} onClick={() => setPending({ kind: 'publish' })}>
                  Publish…
                </Button>
              ) : exercise.state === 'published' ? (
                <Button disabled={busy} onClick={() => setPending({ kind: 'close' })}>
                  Close…
                </Button>
              ) : (
                <Button disabled={busy} onClick={() => setPending({ kind: 'reopen' })}>
                  Reopen…
                </Button>
              )}
            </div>
          ) : null}
        </section>
      ) : null}

      {notice ? (
        <p role="status" className="rounded-[3px] border border-bonding/50 bg-sheet px-4 py-2 text-bonding" data-testid="editor-notice">
          {notice}
        </p>
      ) : null}
      {remarkJobId ? (
        <section aria-label="Re-marking progress" className="rounded-[3px] border border-rule bg-sheet px-4 py-3" data-testid="remark-progress">
          <JobProgress jobId={remarkJobId} label="Re-marking the reports" />
        </section>
      ) : null}
      {failure && !(showErrors && errorList.length) ? (
        <p role="alert" className="rounded-[3px] border border-antibonding/50 bg-sheet px-4 py-2 text-antibonding" data-testid="editor-failure">
          {failure}
        </p>
      ) : null}
      {showErrors && errorList.length ? (
        <div ref={summaryRef} tabIndex={-1} role="alert" className="rounded-[3px] border border-antibonding/50 bg-sheet px-4 py-3" data-testid="error-summary">
          <p className="font-semibold text-antibonding">
            {errorList.length === 1 ? 'One field needs attention' : `${errorList.length} fields need attention`} before this can be saved:
          </p>
          <ul className="mt-1 list-disc pl-5 text-[0.9rem]">
            {errorList.slice(0, 12).map(([path, message]) => (
              <li key={path}>
                <a href={`#${fieldId(path)}`} onClick={(e) => focusField(e, path)} className="text-reference underline">
                  <Num>{path}</Num>
                </a>
                : {message}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      <form
        noValidate
        onSubmit={(e) => {
          e.preventDefault();
          save(false);
        }}
        className="grid gap-5"
        aria-label="Exercise"
      >
        <fieldset disabled={readOnly} className="grid min-w-0 gap-5">
          <Fieldset legend="Exercise">
            <div className="grid gap-3">
              <TextField path="title" label="Title" issues={issues} value={spec.title} onChange={(v) => set('title', v)} />
              <MarkdownField value={spec.instructionsMarkdown ?? ''} onChange={(v) => set('instructionsMarkdown', v)} issues={issues} />
            </div>
          </Fieldset>

          <Fieldset legend="Model and variants" description="The model students compute, and how each student's variant is drawn. The same seed and student number always give the same variant.">
            <div className="grid gap-3">
              <ModelFields model={spec.model} onModel={(m) => set('model', m)} onFamily={(f) => change(switchFamily(spec, f))} issues={issues} />
              <TextField path="variantSeed" label="Seed" hint="Any text. Changing it after publication redraws every variant." issues={issues} value={spec.variantSeed} onChange={(v) => set('variantSeed', v)} />
            </div>
          </Fieldset>

          <Fieldset legend="Hand-in and lateness">
            <div className="grid gap-3 sm:grid-cols-2">
              <FieldShell path="dueLocal" label="Due" issues={issues} hint="Wall-clock time in the time zone beside.">
                {(a11y) => <input {...a11y} type="datetime-local" value={spec.dueLocal} onChange={(e) => set('dueLocal', e.target.value)} className={`${inputClasses} num`} />}
              </FieldShell>
              <SelectField path="timeZone" label="Time zone" issues={issues} value={spec.timeZone ?? 'Europe/London'} onChange={(v) => set('timeZone', v)} options={zones.map((z) => [z, z.replace(/_/g, ' ')] as const)} />
              <NumberField path="late.graceMinutes" label="Grace period" unit="minutes" issues={issues} value={spec.late.graceMinutes} onChange={(v) => set('late', { ...spec.late, graceMinutes: v })} />
              <NumberField path="late.penaltyPerDayPercent" label="Penalty per started day late" unit="%" issues={issues} value={spec.late.penaltyPerDayPercent} onChange={(v) => set('late', { ...spec.late, penaltyPerDayPercent: v })} />
              <NumberField path="late.capPercent" label="Largest late penalty" unit="%" issues={issues} value={spec.late.capPercent} onChange={(v) => set('late', { ...spec.late, capPercent: v })} />
              <SelectField
                path="writeUp"
                label="Write-up (PDF)"
                issues={issues}
                value={spec.writeUp ?? 'optional'}
                onChange={(v) => set('writeUp', v)}
                options={[
                  ['none', 'None'],
                  ['optional', 'Optional'],
                  ['required', 'Required'],
                ]}
              />
              <SelectField
                path="automaticMarks"
                label="Students see the automatic mark"
                hint="At once: each upload shows its automatic mark, feedback and plot, marked provisional until an assistant returns the report. On return: nothing until then."
                issues={issues}
                value={spec.automaticMarks ?? 'at-once'}
                onChange={(v) => set('automaticMarks', v)}
                options={[
                  ['at-once', 'At once (provisional)'],
                  ['on-return', 'On return'],
                ]}
              />
              <fieldset className="min-w-0 sm:col-span-2" data-field="allowedFileTypes">
                <legend className="mb-1 text-sm font-semibold text-ink">Data files accepted</legend>
                <div className="flex flex-wrap gap-4">
                  {uploadFileTypes.map((t) => {
                    const list = spec.allowedFileTypes ?? ['csv', 'tsv', 'xlsx'];
                    return (
                      <label key={t} className="inline-flex items-center gap-2">
                        <input
                          type="checkbox"
                          className="size-4 accent-reference"
                          checked={list.includes(t)}
                          onChange={(e) => set('allowedFileTypes', uploadFileTypes.filter((x) => (x === t ? e.target.checked : list.includes(x))))}
                        />
                        <span className="num">.{t}</span>
                      </label>
                    );
                  })}
                </div>
                {issues.get('allowedFileTypes') ? <p className="mt-0.5 text-[0.85rem] font-semibold text-antibonding">{issues.get('allowedFileTypes')}</p> : null}
              </fieldset>
            </div>
          </Fieldset>

          <Fieldset legend="Marking scheme" description="Checks apply to the model chosen above. Weights are shown as shares of the mark.">
            <SchemeEditor family={spec.model.family} checks={spec.scheme.checks} onChange={(checks) => set('scheme', { checks })} issues={issues} />
          </Fieldset>
        </fieldset>

        {!readOnly ? (
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" variant="primary" disabled={busy}>
              {busy ? 'Saving…' : exercise ? (exercise.state === 'draft' ? 'Save draft' : 'Save as new revision…') : 'Create draft'}
            </Button>
            {exercise && !dirty ? <span className="text-sm text-graphite">All changes saved.</span> : null}
            {exercise && dirty && exercise.state !== 'draft' ? <span className="text-sm text-caution">Saving changes re-marks every report.</span> : null}
          </div>
        ) : null}
      </form>

      <section aria-labelledby="preview-heading" className="grid gap-3 rounded-[3px] border border-rule bg-sheet px-4 py-3">
        <h2 id="preview-heading" className="font-serif text-xl font-semibold text-ink">
          Preview
        </h2>
        <VariantPreviewPanel model={parsedModel} seed={spec.variantSeed} exerciseId={exercise?.id} saved={Boolean(exercise) && !dirty} showStudents={Boolean(exercise)} />
      </section>

      <ConfirmDialog
        open={pending?.kind === 'remark'}
        title={pending?.kind === 'remark' ? `Save as revision ${pending.nextRevisionNo} and re-mark?` : ''}
        confirmLabel="Save and re-mark"
        tone="primary"
        focus="confirm"
        busyLabel="Working…"
        busy={update.isPending}
        onCancel={() => setPending(null)}
        onConfirm={() => save(true)}
      >
        {pending?.kind === 'remark' ? (
          <p>
            This exercise is {exercise?.state}. Saving creates revision <Num>{pending.nextRevisionNo}</Num>, published at once. Students whose variant rule is unchanged keep their variant.{' '}
            {pending.reportCount > 0 ? (
              <>
                All <Num>{pending.reportCount}</Num> reports handed in so far will be marked again; human adjustments are kept.
              </>
            ) : (
              'No reports have been handed in yet, so there is nothing to re-mark now.'
            )}
          </p>
        ) : null}
      </ConfirmDialog>
      <ConfirmDialog open={pending?.kind === 'publish'} title="Publish this exercise?" confirmLabel="Publish" tone="primary" focus="confirm" busyLabel="Working…" busy={transition.isPending} onCancel={() => setPending(null)} onConfirm={() => runTransition('publish', 'Published.')}>
        <p>
          Publishing freezes revision <Num>{exercise?.revision.revisionNo}</Num> and draws a variant for each of the <Num>{counts?.students ?? 0}</Num> students on the roster. Students then see the exercise and can fetch their template. Later changes make a new revision and re-mark reports.
        </p>
      </ConfirmDialog>
      <ConfirmDialog open={pending?.kind === 'close'} title="Close this exercise?" confirmLabel="Close exercise" tone="danger" focus="confirm" busyLabel="Working…" busy={transition.isPending} onCancel={() => setPending(null)} onConfirm={() => runTransition('close', 'Closed.')}>
        <p>Students keep seeing it, but it is marked closed. You can reopen it later.</p>
      </ConfirmDialog>
      <ConfirmDialog open={pending?.kind === 'reopen'} title="Reopen this exercise?" confirmLabel="Reopen" tone="primary" focus="confirm" busyLabel="Working…" busy={transition.isPending} onCancel={() => setPending(null)} onConfirm={() => runTransition('publish', 'Reopened.')}>
        <p>It becomes published again; students enrolled since it closed get their variants now.</p>
      </ConfirmDialog>
    </div>
  );
}
