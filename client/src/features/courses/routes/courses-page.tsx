import { useMemo } from 'react';
import { Link } from 'react-router';
import { buttonClasses } from '@client/components/ui/button';
import { EmptyState } from '@client/components/ui/empty-state';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { PageHeader } from '@client/components/ui/page-header';
import { useCurrentUser } from '@client/features/session/api/get-me';
import { hasRole, isStaff } from '@client/features/session/lib/roles';
import { formatCount } from '@client/lib/format';
import { useCourses } from '../api/get-courses';
import { CoursesTable } from '../components/courses-table';

/** /courses: "Courses" for staff, "My courses" for students. The server decides which courses are listed. */
export function CoursesPage() {
  const me = useCurrentUser();
  const staff = isStaff(me);
  const courses = useCourses();
  const title = staff ? 'Courses' : 'My courses';
  // admins, and lecturers (the server checks again)
  const canCreate = hasRole(me, 'admin') || hasRole(me, 'lecturer');

  const counts = useMemo(() => {
    const list = courses.data ?? [];
    return { total: list.length, running: list.filter((c) => !c.archived).length };
  }, [courses.data]);

  return (
    <>
      <title>{`${title} · Bondmark`}</title>
      <PageHeader
        title={title}
        description={
          staff
            ? me.isAdmin
              ? 'Every course of every term in the department.'
              : 'The courses you teach on, as lecturer or assistant.'
            : 'The courses you are enrolled on.'
        }
        actions={
          <>
            {courses.data && courses.data.length > 0 ? (
              <p className="text-sm text-graphite" data-testid="courses-count">
                <Num>{formatCount(counts.total)}</Num> {counts.total === 1 ? 'course' : 'courses'},{' '}
                <Num>{formatCount(counts.running)}</Num> running
              </p>
            ) : null}
            {canCreate ? (
              <Link to="/courses/new" className={`${buttonClasses('primary', 'sm')} no-underline`}>
                New course
              </Link>
            ) : null}
          </>
        }
      />
      {courses.isError ? (
        <ErrorNotice what="the courses" error={courses.error} onRetry={() => void courses.refetch()} />
      ) : courses.data && courses.data.length === 0 ? (
        <EmptyState title="No courses yet" testId="courses-empty">
          {staff
            ? 'A course appears here once a lecturer creates it for a term, or an admin adds you to its teaching team.'
            : 'A course appears here once your department puts you on its roster.'}
        </EmptyState>
      ) : (
        <CoursesTable courses={courses.data} loading={courses.isPending} showStudentCount={staff} />
      )}
    </>
  );
}
