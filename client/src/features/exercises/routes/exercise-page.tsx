import { Link, useParams } from 'react-router';
import type { StaffExercise, StudentExercise } from '@shared/api/exercises';
import { DateTime } from '@client/components/ui/date-time';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { PageHeader } from '@client/components/ui/page-header';
import { StatusText } from '@client/components/ui/status-text';
import { Table, Td, Th } from '@client/components/ui/table';
import { useExercise } from '../api/get-exercise';
import { ExerciseEditor, stateLabel } from '../components/exercise-editor';
import { SafeMarkdown } from '../components/markdown-field';
import { formatDueLocal } from '../lib/due';
import { familyLabel } from '../lib/spec-defaults';

function Revisions({ exercise }: { exercise: StaffExercise }) {
  return (
    <section aria-labelledby="revisions-heading" className="grid gap-2">
      <h2 id="revisions-heading" className="font-serif text-xl font-semibold text-ink">
        Revisions
      </h2>
      <Table label="Revisions of this exercise" testId="revisions-table">
        <thead>
          <tr>
            <Th className="text-right">No.</Th>
            <Th>Created</Th>
            <Th>By</Th>
            <Th>Published</Th>
            <Th>Changed</Th>
            <Th>Engine</Th>
          </tr>
        </thead>
        <tbody>
          {[...exercise.revisions].reverse().map((r) => (
            <tr key={r.id} data-testid="revision-row">
              <Td className="text-right"><Num>{r.revisionNo}</Num></Td>
              <Td><DateTime iso={r.createdAt} /></Td>
              <Td>{r.createdBy.displayName}</Td>
              <Td>{r.publishedAt ? <DateTime iso={r.publishedAt} /> : <span className="text-graphite">draft</span>}</Td>
              <Td>{r.changed.length ? r.changed.join(', ') : <span className="text-graphite">—</span>}</Td>
              <Td><Num>{r.engineVersion}</Num></Td>
            </tr>
          ))}
        </tbody>
      </Table>
    </section>
  );
}

function StudentView({ exercise }: { exercise: StudentExercise }) {
  return (
    <>
      <PageHeader title={exercise.title} description={`${exercise.course.code} · ${familyLabel[exercise.family]}`} />
      <dl className="mb-4 grid gap-x-6 gap-y-1 sm:grid-cols-3" data-testid="student-exercise">
        <div>
          <dt className="text-sm text-graphite">Due</dt>
          <dd><Num>{formatDueLocal(exercise.dueLocal, exercise.timeZone, exercise.dueAt)}</Num></dd>
        </div>
        <div>
          <dt className="text-sm text-graphite">Late rule</dt>
          <dd>
            <Num>{exercise.late.penaltyPerDayPercent}</Num> % per started day after <Num>{exercise.late.graceMinutes}</Num> min grace, at most <Num>{exercise.late.capPercent}</Num> %
          </dd>
        </div>
        <div>
          <dt className="text-sm text-graphite">State</dt>
          <dd>{stateLabel[exercise.state]}</dd>
        </div>
      </dl>
      <div className="rounded-[3px] border border-rule bg-sheet px-4 py-3">
        <SafeMarkdown text={exercise.instructionsMarkdown} />
      </div>
    </>
  );
}

/** /exercises/:exerciseId — the editor for staff (read-only for assistants), the brief for students. */
export function ExercisePage() {
  const id = Number(useParams().exerciseId);
  const query = useExercise(id);
  if (query.isError) return <ErrorNotice what="the exercise" error={query.error} onRetry={() => void query.refetch()} />;
  if (!query.data)
    return (
      <p role="status" className="text-graphite">
        Loading the exercise…
      </p>
    );
  const exercise = query.data;
  if (exercise.view === 'student') return <StudentView exercise={exercise} />;
  return (
    <>
      <title>{`${exercise.spec.title} · Bondmark`}</title>
      <PageHeader
        title={exercise.spec.title}
        description={
          <>
            <Link to={`/courses/${exercise.course.id}/exercises`} className="text-reference underline">
              {exercise.course.code}
            </Link>{' '}
            · {familyLabel[exercise.spec.model.family]} ·{' '}
            <StatusText tone={exercise.state === 'published' ? 'good' : exercise.state === 'closed' ? 'caution' : 'neutral'}>{stateLabel[exercise.state]}</StatusText>
            {!exercise.permissions.author ? ' · read only' : null}
          </>
        }
      />
      <div className="grid gap-6">
        <ExerciseEditor key={exercise.id} initial={exercise.spec} courseId={exercise.course.id} exercise={exercise} />
        <Revisions exercise={exercise} />
      </div>
    </>
  );
}

export const Component = ExercisePage;
