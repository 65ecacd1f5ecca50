import { useId, useState, type FormEvent } from 'react';
import { Link } from 'react-router';
import {
  REQUIRED_ROSTER_FIELDS,
  ROSTER_FIELDS,
  ROSTER_FIELD_LABEL,
  ROSTER_FILE_MAX_BYTES,
  type MissingStudent,
  type PreviewRow,
  type RosterApplyResult,
  type RosterMapping,
  type RosterPreview,
  type RowStatus,
} from '@shared/api/roster';
import { Button } from '@client/components/ui/button';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { StatusText } from '@client/components/ui/status-text';
import { Table, Td, Th } from '@client/components/ui/table';
import { FormError, inputClasses } from '@client/features/courses/components/form-fields';
import { useCourseFromLayout } from '@client/features/courses/lib/course-context';
import { useApplyRoster, usePreviewRoster } from '../api/import-roster';

type Step = 'file' | 'columns' | 'check' | 'done';
const STEPS: { id: Step; label: string }[] = [
  { id: 'file', label: 'File' },
  { id: 'columns', label: 'Columns' },
  { id: 'check', label: 'Check' },
  { id: 'done', label: 'Done' },
];

const STATUS_LABEL: Record<RowStatus, { label: string; tone: 'good' | 'caution' | 'neutral' | 'bad' }> = {
  new: { label: 'New', tone: 'good' },
  changed: { label: 'Changed', tone: 'caution' },
  unchanged: { label: 'No change', tone: 'neutral' },
  error: { label: 'Error', tone: 'bad' },
};

function Steps({ current }: { current: Step }) {
  const index = STEPS.findIndex((s) => s.id === current);
  return (
    <ol className="mb-5 flex flex-wrap gap-x-6 gap-y-1 text-sm" aria-label="Import steps">
      {STEPS.map((s, i) => (
        <li key={s.id} aria-current={s.id === current ? 'step' : undefined} className={i === index ? 'font-semibold text-ink' : i < index ? 'text-bonding' : 'text-graphite'}>
          <Num>{i + 1}</Num> {s.label}
        </li>
      ))}
    </ol>
  );
}

function Counts({ summary }: { summary: RosterPreview['summary'] }) {
  const items: [string, number][] = [
    ['rows', summary.rows],
    ['new', summary.new],
    ['changed', summary.changed],
    ['no change', summary.unchanged],
    ['with errors', summary.error],
    ['missing from the file', summary.missing],
  ];
  return (
    <dl className="mb-4 flex flex-wrap gap-x-6 gap-y-1" data-testid="import-counts">
      {items.map(([label, n]) => (
        <div key={label} className="flex items-baseline gap-1.5">
          <dt className="order-2 text-graphite">{label}</dt>
          <dd className="order-1">
            <Num className={label === 'with errors' && n > 0 ? 'font-semibold text-antibonding' : 'font-semibold'}>{n}</Num>
          </dd>
        </div>
      ))}
    </dl>
  );
}

function RowDetails({ row }: { row: PreviewRow }) {
  if (row.errors.length) {
    return (
      <ul className="text-antibonding">
        {row.errors.map((e) => (
          <li key={e.message}>{e.message}</li>
        ))}
      </ul>
    );
  }
  return (
    <>
      {row.changes.map((c) => (
        <div key={c.field}>
          {ROSTER_FIELD_LABEL[c.field]}: <span className="text-graphite line-through">{c.from ?? '—'}</span> → {c.to ?? '—'}
        </div>
      ))}
      {row.notes.map((n) => (
        <div key={n} className="text-graphite">
          {n}
        </div>
      ))}
    </>
  );
}

function MissingTable({ missing }: { missing: MissingStudent[] }) {
  if (!missing.length) return null;
  return (
    <section aria-labelledby="missing-title" className="mt-6">
      <h3 id="missing-title" className="mb-1 font-serif text-lg font-semibold">
        Students missing from this file
      </h3>
      <p className="mb-2 max-w-[70ch] text-graphite">
        They are on the roster but not in the file. The import leaves them as they are; withdraw them on the roster if they
        have left the course.
      </p>
      <Table label="Students missing from this file" testId="missing-table">
        <thead>
          <tr>
            <Th>Student number</Th>
            <Th>Name</Th>
            <Th>E-mail</Th>
            <Th>Section</Th>
          </tr>
        </thead>
        <tbody>
          {missing.map((m) => (
            <tr key={m.enrolmentId}>
              <Td>
                <Num>{m.studentNumber}</Num>
              </Td>
              <Td>{[m.givenName, m.familyName].filter(Boolean).join(' ')}</Td>
              <Td className="break-all">{m.email}</Td>
              <Td>{m.section ?? <span className="text-graphite">None</span>}</Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </section>
  );
}

/**
 * /courses/:courseId/roster/import: choose the registrar's file → match its
 * columns → check every row (nothing is written) → apply all rows at once.
 * The file is sent again on apply, with the preview's SHA-256; nothing is kept
 * on the server between the steps.
 */
export function RosterImportPage() {
  const course = useCourseFromLayout();
  const preview = usePreviewRoster(course.id);
  const apply = useApplyRoster(course.id);
  const [step, setStep] = useState<Step>('file');
  const [file, setFile] = useState<File | null>(null);
  const [tooBig, setTooBig] = useState(false);
  const [mapping, setMapping] = useState<RosterMapping | null>(null);
  const [result, setResult] = useState<RosterApplyResult | null>(null);
  const [show, setShow] = useState<'all' | RowStatus>('all');
  const ids = { file: useId(), show: useId() };
  const data = preview.data;

  if (!course.permissions.manageRoster) {
    return <ErrorNotice what="the import" error={new Error('Only the lecturers of a running course import its roster.')} />;
  }

  const readFile = (event: FormEvent) => {
    event.preventDefault();
    if (!file) return;
    apply.reset();
    preview.mutate(
      { file },
      {
        onSuccess: (p) => {
          setMapping(p.suggestedMapping);
          setStep('columns');
        },
      },
    );
  };
  const checkRows = (event: FormEvent) => {
    event.preventDefault();
    if (!file || !mapping) return;
    preview.mutate({ file, mapping }, { onSuccess: () => setStep('check') });
  };
  const applyNow = () => {
    if (!file || !mapping || !data) return;
    apply.mutate({ file, mapping, sha256: data.sha256 }, { onSuccess: (r) => { setResult(r); setStep('done'); } });
  };
  const restart = () => {
    preview.reset();
    apply.reset();
    setFile(null);
    setMapping(null);
    setResult(null);
    setStep('file');
  };

  const rows = data ? (show === 'all' ? data.rows : data.rows.filter((r) => r.status === show)) : [];

  return (
    <>
      <title>{`Import roster · ${course.code} · Bondmark`}</title>
      <div className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="font-serif text-xl font-semibold">Import the roster</h2>
        <Link to=".." relative="path" className="text-sm">
          Back to the roster
        </Link>
      </div>
      <Steps current={step} />

      {step === 'file' ? (
        <form onSubmit={readFile} className="grid max-w-[40rem] gap-3" aria-label="Choose the roster file">
          <div className="flex flex-col">
            <label htmlFor={ids.file} className="mb-1 text-sm font-semibold text-ink">
              Roster file (CSV or XLSX)
            </label>
            <input
              id={ids.file}
              type="file"
              accept=".csv,.txt,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
              onChange={(e) => {
                const chosen = e.target.files?.[0] ?? null;
                setTooBig(Boolean(chosen && chosen.size > ROSTER_FILE_MAX_BYTES));
                setFile(chosen);
              }}
              className="text-ink file:mr-3 file:rounded-[3px] file:border file:border-rule-strong file:bg-sheet file:px-3 file:py-1.5 file:font-semibold file:text-ink"
            />
            <p className="mt-1 text-[0.85rem] text-graphite">
              The registrar&rsquo;s export, one student a row under a header row: student number, family name, given name,
              e-mail, and optionally the section. At most <Num>5</Num> MB. Nothing is changed until you apply.
            </p>
          </div>
          {tooBig ? <FormError error={new Error('The file is larger than 5 MB; a roster is far smaller. Is it the right file?')} /> : null}
          <FormError error={preview.error} />
          <div>
            <Button type="submit" variant="primary" disabled={!file || tooBig || preview.isPending} aria-busy={preview.isPending || undefined}>
              Read file
            </Button>
          </div>
        </form>
      ) : null}

      {step === 'columns' && data && mapping ? (
        <form onSubmit={checkRows} aria-label="Match the columns">
          <p className="mb-3 max-w-[70ch] text-graphite">
            Read <span className="text-ink">{data.fileName}</span> ({data.format === 'xlsx' ? `sheet “${data.sheetName}”` : `CSV, separated by “${data.delimiter === '\t' ? 'tab' : data.delimiter}”`}
            ): <Num>{data.columns.length}</Num> columns, header on row <Num>{data.headerRowNumber}</Num>. Check which column holds what.
          </p>
          <Table label="Column mapping" testId="mapping-table">
            <thead>
              <tr>
                <Th>Roster field</Th>
                <Th>Column in the file</Th>
                <Th>First values</Th>
              </tr>
            </thead>
            <tbody>
              {ROSTER_FIELDS.map((field) => {
                const index = mapping[field];
                const column = index === null ? null : data.columns[index];
                return (
                  <tr key={field}>
                    <Td className="font-semibold whitespace-nowrap">
                      <label htmlFor={`map-${field}`}>{ROSTER_FIELD_LABEL[field]}</label>
                      {REQUIRED_ROSTER_FIELDS.includes(field) ? <span className="ml-1 font-normal text-graphite">(required)</span> : <span className="ml-1 font-normal text-graphite">(optional)</span>}
                    </Td>
                    <Td>
                      <select
                        id={`map-${field}`}
                        className={`${inputClasses} w-[18rem]`}
                        value={index ?? ''}
                        onChange={(e) => setMapping({ ...mapping, [field]: e.target.value === '' ? null : Number(e.target.value) })}
                      >
                        <option value="">Not in the file</option>
                        {data.columns.map((c) => (
                          <option key={c.index} value={c.index}>
                            {c.letter} · {c.header}
                          </option>
                        ))}
                      </select>
                    </Td>
                    <Td className="text-graphite">{column ? column.samples.join(' · ') || '(empty)' : '—'}</Td>
                  </tr>
                );
              })}
            </tbody>
          </Table>
          <div className="mt-3">
            <FormError error={preview.error} />
          </div>
          <div className="mt-4 flex gap-2">
            <Button type="submit" variant="primary" disabled={preview.isPending} aria-busy={preview.isPending || undefined}>
              Check rows
            </Button>
            <Button onClick={restart}>Choose another file</Button>
          </div>
        </form>
      ) : null}

      {step === 'check' && data ? (
        <section aria-label="Check the rows">
          <Counts summary={data.summary} />
          {data.problems.length ? (
            <div role="alert" className="mb-4 rounded-[3px] border border-antibonding/50 bg-sheet px-4 py-3 text-antibonding" data-testid="import-problems">
              <ul>
                {data.problems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            </div>
          ) : null}
          {data.warnings.length ? (
            <ul className="mb-4 text-caution" data-testid="import-warnings">
              {data.warnings.map((w) => (
                <li key={w}>◆ {w}</li>
              ))}
            </ul>
          ) : null}
          <div className="mb-3 flex flex-wrap items-end justify-between gap-3">
            <div className="flex flex-col">
              <label htmlFor={ids.show} className="mb-1 text-sm font-semibold text-ink">
                Show
              </label>
              <select id={ids.show} value={show} onChange={(e) => setShow(e.target.value as typeof show)} className={`${inputClasses} w-[12rem]`}>
                <option value="all">All rows</option>
                <option value="error">Rows with errors</option>
                <option value="new">New students</option>
                <option value="changed">Changed</option>
                <option value="unchanged">No change</option>
              </select>
            </div>
            <div className="flex flex-wrap items-center gap-2">
              <Button onClick={() => setStep('columns')}>Back to columns</Button>
              <Button variant="primary" onClick={applyNow} disabled={!data.canApply || apply.isPending} aria-busy={apply.isPending || undefined} aria-describedby="apply-note">
                Apply import
              </Button>
            </div>
          </div>
          <p id="apply-note" className="mb-3 text-[0.9rem] text-graphite">
            {data.canApply
              ? `Applying adds ${data.summary.new} and updates ${data.summary.changed} students in one step.`
              : data.summary.error
                ? `Nothing can be applied while ${data.summary.error} ${data.summary.error === 1 ? 'row has' : 'rows have'} errors: correct the file and choose it again.`
                : 'Nothing can be applied until the problems above are solved.'}
          </p>
          <FormError error={apply.error} />
          <Table label="Rows of the file" testId="preview-table">
            <thead>
              <tr>
                <Th className="text-right">Row</Th>
                <Th>Status</Th>
                <Th>Student number</Th>
                <Th>Family name</Th>
                <Th>Given name</Th>
                <Th>E-mail</Th>
                <Th>Section</Th>
                <Th>Details</Th>
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.rowNumber} data-testid="preview-row" data-status={r.status}>
                  <Td className="text-right">
                    <Num>{r.rowNumber}</Num>
                  </Td>
                  <Td>
                    <StatusText tone={STATUS_LABEL[r.status].tone}>{STATUS_LABEL[r.status].label}</StatusText>
                  </Td>
                  <Td>
                    <Num>{r.studentNumber}</Num>
                  </Td>
                  <Td>{r.familyName}</Td>
                  <Td>{r.givenName}</Td>
                  <Td className="break-all">{r.email}</Td>
                  <Td>{r.section ?? <span className="text-graphite">—</span>}</Td>
                  <Td className="min-w-[18rem]">
                    <RowDetails row={r} />
                  </Td>
                </tr>
              ))}
              {rows.length === 0 ? (
                <tr>
                  <Td colSpan={8} className="py-5 text-center text-graphite">
                    No rows of this kind.
                  </Td>
                </tr>
              ) : null}
            </tbody>
          </Table>
          <MissingTable missing={data.missing} />
        </section>
      ) : null}

      {step === 'done' && result ? (
        <section aria-label="Import applied" data-testid="import-done">
          <p role="status" className="mb-3 text-bonding">
            ● The roster was updated from {data?.fileName}.
          </p>
          <Counts summary={result.summary} />
          <div className="flex gap-2">
            <Link to=".." relative="path" className="font-semibold">
              Open the roster
            </Link>
            <Button size="sm" variant="quiet" onClick={restart}>
              Import another file
            </Button>
          </div>
          <MissingTable missing={result.missing} />
        </section>
      ) : null}
    </>
  );
}
