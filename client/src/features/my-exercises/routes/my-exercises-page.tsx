import { useEffect, useMemo, useState } from 'react';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { PageHeader } from '@client/components/ui/page-header';
import { useMyExercises } from '../api/get-my-exercises';
import { MyExercisesTable } from '../components/my-exercises-table';

/** The clock for "in 3 days", ticking once a minute. */
function useNow(): number {
  const [now, setNow] = useState(() => Date.now());
  useEffect(() => {
    const id = setInterval(() => setNow(Date.now()), 60_000);
    return () => clearInterval(id);
  }, []);
  return now;
}

/** /my/exercises: a student's published exercises with due dates, late status, template download and upload. */
export function MyExercisesPage() {
  const exercises = useMyExercises();
  const now = useNow();
  const list = exercises.data?.exercises;
  const counts = useMemo(
    () => ({ total: list?.length ?? 0, open: list?.filter((e) => e.window !== 'closed').length ?? 0 }),
    [list],
  );

  return (
    <>
      <title>My exercises · Bondmark</title>
      <PageHeader
        title="My exercises"
        description="Download your personal template, fill it in and upload it as your report. Due times are shown in each exercise's own time zone."
        actions={
          list && list.length > 0 ? (
            <p className="text-sm text-graphite" data-testid="my-exercises-count">
              <Num>{counts.total}</Num> {counts.total === 1 ? 'exercise' : 'exercises'}, <Num>{counts.open}</Num> still taking uploads
            </p>
          ) : null
        }
      />
      {exercises.isError ? (
        <ErrorNotice what="your exercises" error={exercises.error} onRetry={() => void exercises.refetch()} />
      ) : list && list.length === 0 ? (
        <EmptyState title="No exercises yet" testId="my-exercises-empty">
          An exercise appears here once a lecturer of one of your courses publishes it.
        </EmptyState>
      ) : (
        <MyExercisesTable exercises={list} loading={exercises.isPending} nowMs={now} />
      )}
    </>
  );
}
