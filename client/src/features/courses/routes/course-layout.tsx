import { NavLink, Outlet, useParams } from 'react-router';
import { DateTime } from '@client/components/ui/date-time';
import { ErrorNotice } from '@client/components/ui/error-notice';
import { Num } from '@client/components/ui/num';
import { PageHeader } from '@client/components/ui/page-header';
import { RoleBadge } from '@client/components/ui/role-badge';
import { StatusText } from '@client/components/ui/status-text';
import { useCourse } from '../api/get-course';
import type { CourseOutletContext } from '../lib/course-context';

/** The tabs of a course page, by what the caller may see. */
export function courseTabs(course: { permissions: { viewRoster: boolean; editCourse: boolean }; myRole: string | null }) {
  const staff = course.permissions.viewRoster || course.permissions.editCourse;
  const tabs: { to: string; label: 'Sections' | 'Roster' | 'Exercises' | 'Settings' }[] = [];
  if (staff) tabs.push({ to: 'sections', label: 'Sections' }, { to: 'roster', label: 'Roster' });
  // /courses/:courseId/exercises is registered by the exercises feature (router.tsx, a child of this route).
  tabs.push({ to: 'exercises', label: 'Exercises' });
  if (course.permissions.editCourse) tabs.push({ to: 'settings', label: 'Settings' });
  return tabs;
}

/**
 * /courses/:courseId/*: the course header and its tabs; the tab's page renders
 * in the <Outlet/> and gets the course through useCourseFromLayout().
 */
export function CourseLayout() {
  const courseId = Number(useParams().courseId);
  const course = useCourse(courseId);

  if (course.isError) return <ErrorNotice what="the course" error={course.error} onRetry={() => void course.refetch()} />;
  if (!course.data) {
    return (
      <p role="status" className="text-graphite">
        Loading the course…
      </p>
    );
  }
  const c = course.data;
  const context: CourseOutletContext = { course: c };
  return (
    <>
      <title>{`${c.code} · Bondmark`}</title>
      <PageHeader
        title={
          <>
            <Num className="mr-2 font-semibold">{c.code}</Num>
            {c.title}
          </>
        }
        description={
          <>
            {c.term.name} (<DateTime iso={c.term.startsOn} dateOnly /> – <DateTime iso={c.term.endsOn} dateOnly />)
            {c.lecturers.length ? <> · {c.lecturers.map((l) => l.displayName).join(', ')}</> : null}
          </>
        }
        actions={
          <>
            {c.archived ? <StatusText tone="neutral">Archived</StatusText> : null}
            {c.myRole ? <RoleBadge role={c.myRole} /> : <span className="text-sm text-graphite">Admin view</span>}
          </>
        }
      />
      <nav aria-label="Course pages" className="mb-5 border-b border-rule">
        <ul className="-mb-px flex flex-wrap gap-1">
          {courseTabs(c).map((tab) => (
            <li key={tab.to}>
              <NavLink
                to={tab.to}
                className={({ isActive }) =>
                  `inline-block border-b-2 px-3 py-2 font-semibold no-underline ${isActive ? 'border-reference text-ink' : 'border-transparent text-graphite hover:text-ink'}`
                }
              >
                {tab.label}
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
      <Outlet context={context} />
    </>
  );
}
