import { useMemo } from 'react';
import { Link, useNavigate, useParams } from 'react-router';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { useCourseExercises } from '../api/get-exercises';
import { ExerciseEditor } from '../components/exercise-editor';
import { browserTimeZone, newExerciseSpec } from '../lib/spec-defaults';

/** /courses/:courseId/exercises/new (inside the course page) — a new draft (lecturers of the course, admins). */
export function NewExercisePage() {
  const courseId = Number(useParams().courseId);
  const navigate = useNavigate();
  const list = useCourseExercises(courseId);
  // default zone: the course's latest exercise, else the browser's
  const initial = useMemo(() => (list.data ? newExerciseSpec(list.data.timeZone ?? browserTimeZone()) : null), [list.data]);
  return (
    <>
      <title>New exercise · Bondmark</title>
      <div className="mb-4 flex flex-wrap items-baseline justify-between gap-3">
        <h2 className="font-serif text-xl font-semibold text-ink">New exercise</h2>
        <p className="text-sm text-graphite">
          A draft until you publish it.{' '}
          <Link to={`/courses/${courseId}/exercises`} className="text-reference underline">
            Back to the exercises
          </Link>
        </p>
      </div>
      {list.isError ? (
        <ErrorNotice what="the course" error={list.error} />
      ) : list.data && !list.data.canAuthor ? (
        <EmptyState title="Only the lecturers of this course write its exercises" />
      ) : initial ? (
        <ExerciseEditor initial={initial} courseId={courseId} onCreated={(r) => void navigate(`/exercises/${r.exercise.id}`, { replace: true })} />
      ) : (
        <p role="status" className="text-graphite">
          Loading…
        </p>
      )}
    </>
  );
}

export const Component = NewExercisePage;
