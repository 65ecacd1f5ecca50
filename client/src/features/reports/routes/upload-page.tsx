import { useCallback, useRef, useState } from 'react';
import { Link, useParams, useSearchParams } from 'react-router';
import type { ReadPreview, ReadRefusalDetails, ReportChoice, ReportSummary, UploadResult } from '@shared/api/reports';
import { Button } from '@client/components/ui/button';
import { DateTime } from '@client/components/ui/date-time';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { PageHeader } from '@client/components/ui/page-header';
import { StatusText } from '@client/components/ui/status-text';
import { isApiError } from '@client/lib/api';
import { formatInZone } from '@client/features/my-exercises/lib/due-text';
import { useExerciseReports } from '../api/get-exercise-reports';
import { useReport } from '../api/get-report';
import { useReadReport, useUploadReport } from '../api/upload-report';
import type { UploadProgress } from '../api/send-upload';
import { DropZone } from '../components/drop-zone';
import { LateStatusText } from '../components/late-status';
import { MarkView } from '../components/mark-view';
import { OverlayPlot } from '../components/overlay-plot';
import { ProgressBar } from '../components/progress-bar';
import { ReadBack, choiceOf } from '../components/read-back';
import { VersionsTable } from '../components/versions-table';
import { durationText, formatBytes } from '../lib/series';

type Phase = { kind: 'idle' } | { kind: 'reading'; progress: UploadProgress | null } | { kind: 'uploading'; progress: UploadProgress | null };

/** The refusal as the student should read it: the reader's sentence, and where in the file. */
function Refusal({ error }: { error: unknown }) {
  const message = error instanceof Error ? error.message : 'The upload failed.';
  const details = isApiError(error) ? (error.details as Partial<ReadRefusalDetails> | undefined) : undefined;
  const place = details?.reader ? [details.reader.sheet ? `sheet “${details.reader.sheet}”` : '', details.reader.row ? `row ${details.reader.row}` : '', details.reader.column ? `column ${details.reader.column}` : ''].filter(Boolean) : [];
  const what = details?.field === 'writeup' ? 'The write-up was not accepted' : details?.field === 'choice' ? 'That choice does not fit the file' : 'The file was not accepted';
  return (
    <div role="alert" className="rounded-[3px] border border-antibonding/60 bg-sheet px-4 py-3" data-testid="upload-refusal">
      <p className="font-semibold text-antibonding">{what}. Nothing was stored.</p>
      <p className="text-ink">{message}</p>
      {place.length ? (
        <p className="text-[0.85rem] text-graphite">
          Where: <Num>{place.join(', ')}</Num>
          {details?.reader?.expected ? <> — expected {details.reader.expected}</> : null}
        </p>
      ) : null}
    </div>
  );
}

/**
 * The newest version's mark with the plot against the reference. A student sees it at once when
 * the exercise gives automatic marks at once (labelled provisional until the report is returned).
 */
function NewestVersionMark({ report, staff }: { report: ReportSummary & { mark: NonNullable<ReportSummary['mark']> }; staff: boolean }) {
  const detail = useReport(report.id);
  const provisional = !staff && report.state !== 'returned';
  const overlay = detail.data?.overlay;
  return (
    <div className="flex flex-col gap-4" data-testid="newest-mark">
      <MarkView mark={report.mark} provisional={provisional} showRevision={staff} title={`${provisional ? 'Automatic mark' : 'Mark'} of version ${report.versionNo}`} />
      {detail.isError ? (
        <p className="text-[0.9rem] text-antibonding">The plot against the reference could not be loaded: {detail.error.message}</p>
      ) : !detail.data ? (
        <p role="status" className="text-[0.9rem] text-graphite">
          Loading the plot against the reference…
        </p>
      ) : overlay ? (
        <OverlayPlot overlay={overlay} title={staff ? 'Student against reference' : 'Your data against the reference'} fileBase={`report-${report.id}-overlay`} />
      ) : null}
    </div>
  );
}

/** /my/exercises/:exerciseId/upload — a student hands in a report (staff: ?enrolmentId= for a student). */
export function UploadReportPage() {
  const params = useParams();
  const exerciseId = Number(params.exerciseId);
  const [search] = useSearchParams();
  const enrolmentId = search.get('enrolmentId') ? Number(search.get('enrolmentId')) : undefined;
  const reports = useExerciseReports(exerciseId, enrolmentId);
  const reader = useReadReport(exerciseId, enrolmentId);
  const uploader = useUploadReport(exerciseId, enrolmentId);

  const [dataFile, setDataFile] = useState<File | null>(null);
  const [writeup, setWriteup] = useState<File | null>(null);
  const [preview, setPreview] = useState<ReadPreview | null>(null);
  const [choice, setChoice] = useState<ReportChoice | null>(null);
  const [phase, setPhase] = useState<Phase>({ kind: 'idle' });
  const [error, setError] = useState<unknown>(null);
  const [done, setDone] = useState<UploadResult | null>(null);
  const request = useRef(0);

  const read = useCallback(
    async (file: File, pdf: File | null, nextChoice: ReportChoice | undefined) => {
      const mine = ++request.current;
      setError(null);
      setPhase({ kind: 'reading', progress: null });
      try {
        const result = await reader.mutateAsync({
          files: { data: file, writeup: pdf, choice: nextChoice },
          onProgress: (p) => mine === request.current && setPhase({ kind: 'reading', progress: p }),
        });
        if (mine !== request.current) return;
        setPreview(result);
        setChoice(choiceOf(result));
      } catch (e) {
        if (mine !== request.current) return;
        setError(e);
        if (!nextChoice) setPreview(null);
      } finally {
        if (mine === request.current) setPhase({ kind: 'idle' });
      }
    },
    [reader],
  );

  const onDataFile = (file: File | null) => {
    setDone(null);
    setDataFile(file);
    setPreview(null);
    setChoice(null);
    setError(null);
    if (file) void read(file, writeup, undefined);
  };

  const onWriteup = (file: File | null) => {
    setWriteup(file);
    if (dataFile) void read(dataFile, file, choice ?? undefined);
  };

  const onChoice = (next: ReportChoice) => {
    setChoice(next);
    if (dataFile) void read(dataFile, writeup, next);
  };

  const confirm = async () => {
    const answersOnly = preview !== null && preview.table === null && Boolean(preview.answers);
    if (!dataFile || (!choice && !answersOnly)) return;
    const mine = ++request.current;
    setError(null);
    setPhase({ kind: 'uploading', progress: null });
    try {
      const result = await uploader.mutateAsync({
        files: { data: dataFile, writeup, choice: choice ?? undefined },
        onProgress: (p) => mine === request.current && setPhase({ kind: 'uploading', progress: p }),
      });
      setDone(result);
      setDataFile(null);
      setWriteup(null);
      setPreview(null);
      setChoice(null);
    } catch (e) {
      setError(e);
    } finally {
      if (mine === request.current) setPhase({ kind: 'idle' });
    }
  };

  const data = reports.data;
  const exercise = data?.exercise;
  const busy = phase.kind !== 'idle';
  const writeUpWord = exercise?.writeUp === 'required' ? 'required' : 'optional';
  const staffView = enrolmentId !== undefined;
  const noCurve = preview !== null && preview.table === null && !preview.answers;
  const answersOnly = preview !== null && preview.table === null && Boolean(preview.answers);
  const newest = data?.reports[0];

  return (
    <>
      <title>{`${exercise ? `Upload · ${exercise.title}` : 'Upload report'} · Bondmark`}</title>
      <PageHeader
        title={exercise ? `Upload report: ${exercise.title}` : 'Upload report'}
        description={
          exercise ? (
            <>
              Due <time dateTime={exercise.effectiveDueAt} className="num">{formatInZone(exercise.effectiveDueAt, exercise.timeZone)}</time>
              {exercise.extensionMinutes > 0 ? <> (with an extension of {durationText(exercise.extensionMinutes)})</> : null}.{' '}
              {exercise.late.penaltyPerDayPercent > 0
                ? `Late uploads lose ${exercise.late.penaltyPerDayPercent}% per started day${exercise.late.graceMinutes ? ` after ${exercise.late.graceMinutes} minutes' grace` : ''}, at most ${exercise.late.capPercent}%.`
                : 'Late uploads are not penalised.'}
              {!staffView ? (
                <>
                  {' '}
                  {exercise.automaticMarks === 'at-once'
                    ? 'You see the automatic mark of each version as soon as it is uploaded; it is provisional until an assistant returns the report.'
                    : 'Marks and feedback appear once an assistant returns your report.'}
                </>
              ) : null}
              {data?.enrolment && staffView ? (
                <>
                  {' '}
                  Uploading for <strong>{data.enrolment.displayName}</strong> (<Num>{data.enrolment.studentNumber}</Num>).
                </>
              ) : null}
            </>
          ) : null
        }
        actions={
          <Link to="/my/exercises" className="text-reference underline-offset-2 hover:underline">
            My exercises
          </Link>
        }
      />

      {reports.isError ? (
        <ErrorNotice what="this exercise" error={reports.error} onRetry={() => void reports.refetch()} />
      ) : !exercise ? (
        <p role="status" className="text-graphite">
          Loading the exercise…
        </p>
      ) : (
        <div className="flex flex-col gap-6">
          {done ? (
            <div role="status" className="rounded-[3px] border border-bonding/60 bg-sheet px-4 py-3" data-testid="upload-done">
              <p className="font-semibold text-bonding">
                Version <Num>{done.report.versionNo}</Num> submitted
              </p>
              <p className="text-[0.9rem]">
                Uploaded <DateTime iso={done.report.uploadedAt} /> · <LateStatusText late={done.report.late} /> · {done.report.dataFile.fileName} (<Num>{formatBytes(done.report.dataFile.sizeBytes)}</Num>)
                {done.report.writeup ? <> with {done.report.writeup.fileName}</> : null}
              </p>
              <p className="text-[0.85rem] text-graphite">
                {done.report.mark
                  ? staffView
                    ? 'The automatic mark is below.'
                    : 'Its automatic mark is below; it is provisional until an assistant returns the report.'
                  : 'Your marks and feedback appear here once your assistant returns the report.'}
              </p>
            </div>
          ) : null}

          {exercise.acceptingUploads ? (
            <section aria-labelledby="files-heading" className="flex flex-col gap-3">
              <h2 id="files-heading" className="font-serif text-xl font-semibold">
                Files
              </h2>
              <div className="grid gap-3 md:grid-cols-2">
                <DropZone
                  label="Data file"
                  buttonLabel="Choose data file"
                  accept=".csv,.tsv,.txt,.dat,.xlsx,text/csv,text/tab-separated-values,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
                  file={dataFile}
                  onFile={onDataFile}
                  disabled={phase.kind === 'uploading'}
                  hint={`Your filled personal template, or any ${exercise.allowedFileTypes.map((t) => t.toUpperCase()).join('/')} file with a distance column and energy columns; at most ${formatBytes(exercise.limits.dataMaxBytes)}.`}
                  testId="data-drop-zone"
                />
                {exercise.writeUp !== 'none' ? (
                  <DropZone
                    label={`Write-up (PDF, ${writeUpWord})`}
                    buttonLabel="Choose write-up"
                    accept=".pdf,application/pdf"
                    file={writeup}
                    onFile={onWriteup}
                    disabled={phase.kind === 'uploading'}
                    hint={`A PDF of at most ${formatBytes(exercise.limits.pdfMaxBytes)}.`}
                    testId="writeup-drop-zone"
                  />
                ) : null}
              </div>

              {phase.kind !== 'idle' ? (
                <ProgressBar
                  label={phase.kind === 'reading' ? 'Reading the file' : 'Uploading the report'}
                  fraction={phase.progress && phase.progress.total > 0 ? phase.progress.loaded / phase.progress.total : null}
                  detail={phase.progress ? `${formatBytes(phase.progress.loaded)} of ${formatBytes(phase.progress.total)}` : undefined}
                  testId="upload-progress"
                />
              ) : null}

              {error ? <Refusal error={error} /> : null}

              {preview ? (
                <>
                  <ReadBack preview={preview} choice={choice} onChange={onChoice} busy={busy} onBehalf={staffView} />
                  {noCurve ? null : (
                    <div className="flex flex-wrap items-center gap-3">
                      <Button variant="primary" onClick={() => void confirm()} disabled={busy || (!choice && !answersOnly) || (exercise.writeUp === 'required' && !writeup)}>
                        Confirm and upload
                      </Button>
                      <Button variant="quiet" onClick={() => onDataFile(null)} disabled={busy}>
                        Start again
                      </Button>
                      {exercise.writeUp === 'required' && !writeup ? <span className="text-caution">This exercise needs a PDF write-up as well.</span> : null}
                    </div>
                  )}
                </>
              ) : null}
            </section>
          ) : (
            <EmptyState title="Uploads are closed">This exercise no longer takes reports. Your versions so far are below.</EmptyState>
          )}

          {newest?.mark ? <NewestVersionMark key={newest.id} report={{ ...newest, mark: newest.mark }} staff={staffView} /> : null}

          <section aria-labelledby="versions-heading" className="flex flex-col gap-2">
            <h2 id="versions-heading" className="font-serif text-xl font-semibold">
              Versions
            </h2>
            {data.reports.length === 0 ? (
              <EmptyState title="Nothing handed in yet" testId="versions-empty">
                Each upload becomes a new version; earlier versions are kept as they were.
              </EmptyState>
            ) : (
              <>
                <p className="text-[0.85rem] text-graphite">
                  <StatusText tone="neutral">
                    <Num>{data.reports.length}</Num> {data.reports.length === 1 ? 'version' : 'versions'}; the newest counts
                  </StatusText>
                </p>
                <VersionsTable reports={data.reports} loading={false} staff={staffView} />
              </>
            )}
          </section>
        </div>
      )}
    </>
  );
}
