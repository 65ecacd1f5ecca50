import { Link, useParams } from 'react-router';
import { useQuery } from '@tanstack/react-query';
import type { CourseDetail } from '@shared/api/courses';
import { buttonClasses } from '@client/components/ui/button';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { PageHeader } from '@client/components/ui/page-header';
import { apiGet } from '@client/lib/api';
import { useCourseExercises } from '../api/get-exercises';
import { ExerciseList } from '../components/exercise-list';

/** The Exercises tab of a course: the list, and "New exercise" for those who may author. */
export function CourseExercisesTab({ courseId }: { courseId: number }) {
  const list = useCourseExercises(courseId);
  const staff = Boolean(list.data?.exercises.some((e) => e.counts !== null)) || Boolean(list.data?.canAuthor);
  return (
    <section aria-labelledby="exercises-heading" className="grid gap-3" data-testid="course-exercises">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <h2 id="exercises-heading" className="font-serif text-xl font-semibold text-ink">
          Exercises
        </h2>
        {list.data?.canAuthor ? (
          <Link to={`/courses/${courseId}/exercises/new`} className={buttonClasses('primary', 'sm')}>
            New exercise
          </Link>
        ) : null}
      </div>
      {list.isError ? (
        <ErrorNotice what="the exercises" error={list.error} onRetry={() => void list.refetch()} />
      ) : list.data && list.data.exercises.length === 0 ? (
        <EmptyState title="No exercises yet" testId="exercises-empty">
          {list.data.canAuthor ? 'Create the first one: pick a model, how variants are drawn, and the marking scheme.' : 'Exercises appear here once a lecturer publishes them.'}
        </EmptyState>
      ) : (
        <ExerciseList exercises={list.data?.exercises} loading={list.isPending} staff={staff} />
      )}
    </section>
  );
}

/** /courses/:courseId/exercises — the tab inside the course page, or on its own with a course header. */
export function CourseExercisesPage({ standalone = true }: { standalone?: boolean }) {
  const courseId = Number(useParams().courseId);
  const course = useQuery({
    queryKey: ['courses', 'one', courseId],
    queryFn: ({ signal }) => apiGet<CourseDetail>(`/api/v1/courses/${courseId}`, { signal }),
    enabled: standalone,
  });
  if (!standalone) return <CourseExercisesTab courseId={courseId} />;
  return (
    <>
      <title>{`Exercises${course.data ? ` · ${course.data.code}` : ''} · Bondmark`}</title>
      <PageHeader title={course.data ? `${course.data.code} ${course.data.title}` : 'Course'} description={course.data?.term.name} />
      <CourseExercisesTab courseId={courseId} />
    </>
  );
}

/** The tab inside the course page (child route of /courses/:courseId). */
export function CourseExercisesRoute() {
  return <CourseExercisesPage standalone={false} />;
}
