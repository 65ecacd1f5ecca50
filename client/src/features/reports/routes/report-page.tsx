import { Link, useParams } from 'react-router';
import { useMutation } from '@tanstack/react-query';
import { distanceUnitLabel, energyUnitLabel } from '@shared/chemistry/units';
import { Button } from '@client/components/ui/button';
import { DateTime } from '@client/components/ui/date-time';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { PageHeader } from '@client/components/ui/page-header';
import { StatusText } from '@client/components/ui/status-text';
import { useCurrentUser } from '@client/features/session/api/get-me';
import { downloadFile } from '@client/features/my-exercises/api/download-template';
import { useReport } from '../api/get-report';
import { LateStatusText } from '../components/late-status';
import { MarkView } from '../components/mark-view';
import { OverlayPlot } from '../components/overlay-plot';
import { formatBytes } from '../lib/series';

const sourceWords: Record<string, string> = { header: 'header', magnitude: 'guessed from the numbers', template: 'template', user: 'chosen by the uploader' };

/**
 * /reports/:reportId — one report: for staff its reading, the checks with
 * their feedback, the overlay plot and the files; for the student who handed
 * it in, the automatic mark and the plot at once (provisional until the report
 * is returned) or, when the exercise holds marks back, once it is returned.
 */
export function ReportPage() {
  const reportId = Number(useParams().reportId);
  const report = useReport(reportId);
  const me = useCurrentUser();
  const download = useMutation({ mutationFn: (args: { url: string; name: string }) => downloadFile(args.url, args.name) });

  if (report.isError) return <ErrorNotice what="this report" error={report.error} onRetry={() => void report.refetch()} />;
  const d = report.data;
  if (!d) {
    return (
      <p role="status" className="text-graphite">
        Loading the report…
      </p>
    );
  }
  const r = d.report;
  const own = me.courses.some((c) => c.courseId === d.exercise.courseId && c.role === 'student');
  const staff = !own || me.isAdmin;

  return (
    <>
      <title>{`Report v${r.versionNo} · ${d.student.displayName} · Bondmark`}</title>
      <PageHeader
        title={
          <>
            {d.exercise.title}: report <Num>v{r.versionNo}</Num>
          </>
        }
        description={
          <>
            {d.student.displayName} (<Num>{d.student.studentNumber}</Num>) · uploaded <DateTime iso={r.uploadedAt} />
            {r.onBehalf ? <> by {r.uploadedBy.displayName}</> : null} · <LateStatusText late={r.late} /> ·{' '}
            <StatusText tone={r.state === 'returned' ? 'good' : 'neutral'}>{r.state === 'returned' ? 'Returned' : r.state === 'marked' ? 'Being reviewed' : 'Submitted'}</StatusText>
          </>
        }
        actions={
          own ? (
            <Link to={`/my/exercises/${d.exercise.id}/upload`} className="text-reference underline-offset-2 hover:underline">
              Back to the upload page
            </Link>
          ) : null
        }
      />

      <div className="flex flex-col gap-6">
        <section aria-labelledby="files-heading" className="flex flex-col gap-2">
          <h2 id="files-heading" className="font-serif text-xl font-semibold">
            Files and reading
          </h2>
          <div className="flex flex-wrap items-center gap-3 text-[0.9rem]">
            <Button size="sm" onClick={() => download.mutate({ url: `/api/v1/reports/${r.id}/data-file`, name: r.dataFile.fileName })}>
              Download data file
            </Button>
            <span>
              {r.dataFile.fileName} (<Num>{formatBytes(r.dataFile.sizeBytes)}</Num>, {r.dataFile.detectedType === 'text' ? 'text' : r.dataFile.detectedType.toUpperCase()}) ·{' '}
              <span className="num text-[0.8rem] text-graphite" title="SHA-256 of the file as uploaded">
                {r.dataFile.sha256.slice(0, 12)}…
              </span>
            </span>
            {r.writeup ? (
              <Button size="sm" onClick={() => download.mutate({ url: `/api/v1/reports/${r.id}/writeup`, name: r.writeup!.fileName })}>
                Download write-up
              </Button>
            ) : (
              <span className="text-graphite">no write-up</span>
            )}
          </div>
          {download.isError ? <p className="text-antibonding">{download.error.message}</p> : null}
          {d.reading.choice && r.units ? (
            <p className="text-[0.9rem]" data-testid="reading-summary">
              Distance from column <Num>{d.reading.choice.distanceColumn}</Num> in <Num>{distanceUnitLabel[r.units.distance]}</Num>
              {d.reading.unitSources ? <span className="text-graphite"> ({sourceWords[d.reading.unitSources.distance]})</span> : null}; energies from{' '}
              {d.reading.choice.energyColumns.length === 1 ? 'column' : 'columns'} <Num>{d.reading.choice.energyColumns.join(', ')}</Num> in <Num>{energyUnitLabel[r.units.energy]}</Num>
              {d.reading.unitSources ? <span className="text-graphite"> ({sourceWords[d.reading.unitSources.energy]})</span> : null}, {r.convention} energies; <Num>{r.pointCount}</Num> points.
              {staff ? (
                <>
                  {' '}
                  Variant <Num>{d.variantKey}</Num>.
                </>
              ) : null}
            </p>
          ) : null}
          {r.warnings.length ? (
            <ul className="text-[0.85rem]" aria-label="Warnings from reading the file">
              {r.warnings.map((w) => (
                <li key={w}>
                  <span aria-hidden="true" className="mr-1.5 text-caution">
                    ◆
                  </span>
                  {w}
                </li>
              ))}
            </ul>
          ) : null}
        </section>

        {r.mark ? (
          <MarkView mark={r.mark} showRevision={staff} provisional={!staff && r.state !== 'returned'} />
        ) : (
          <EmptyState title="Not returned yet" testId="not-returned">
            Marks, feedback and the plot against the reference appear here once the report is returned.
          </EmptyState>
        )}

        {d.overlay ? <OverlayPlot overlay={d.overlay} title={staff ? 'Student against reference' : 'Your data against the reference'} fileBase={`report-${r.id}-overlay`} /> : null}

        {d.versions.length > 1 ? (
          <nav aria-label="Other versions" className="text-[0.9rem]">
            <span className="mr-2 text-graphite">Versions:</span>
            {d.versions.map((v) =>
              v.id === r.id ? (
                <span key={v.id} className="mr-3 font-semibold" aria-current="page">
                  <Num>v{v.versionNo}</Num>
                </span>
              ) : (
                <Link key={v.id} to={`/reports/${v.id}`} className="mr-3 text-reference underline-offset-2 hover:underline">
                  <Num>v{v.versionNo}</Num>
                </Link>
              ),
            )}
          </nav>
        ) : null}
      </div>
    </>
  );
}
