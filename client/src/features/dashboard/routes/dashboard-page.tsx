import { Link } from 'react-router';
import type { CurrentUser } from '@shared/api';
import { EmptyState } from '@client/components/ui/empty-state';
import { Num } from '@client/components/ui/num';
import { RoleBadge } from '@client/components/ui/role-badge';
import { Table, Td, Th } from '@client/components/ui/table';
import { useCurrentUser } from '@client/features/session/api/get-me';
import { isStaff, sortRoles } from '@client/features/session/lib/roles';
import { formatDate } from '@client/lib/format';
import { ROLE_ABILITIES } from '../components/role-abilities';

/** "Good morning" before noon, "Good afternoon" until six, then "Good evening". */
export function greetingFor(hour: number): string {
  if (hour < 12) return 'Good morning';
  if (hour < 18) return 'Good afternoon';
  return 'Good evening';
}

function MyCourses({ me }: { me: CurrentUser }) {
  if (me.courses.length === 0) {
    return (
      <EmptyState title="No courses yet" testId="dashboard-no-courses">
        {me.isAdmin
          ? 'You are not on the teaching team of any course. As admin you can still open every course from the course list.'
          : isStaff(me)
            ? 'A course appears here once a lecturer adds you to its teaching team.'
            : 'A course appears here once your department puts you on its roster.'}
      </EmptyState>
    );
  }
  return (
    <Table label="Your courses" testId="dashboard-courses">
      <thead>
        <tr>
          <Th>Code</Th>
          <Th>Title</Th>
          <Th>Your role</Th>
        </tr>
      </thead>
      <tbody>
        {me.courses.map((course) => (
          <tr key={`${course.courseId}:${course.role}`} data-testid="dashboard-course-row" data-course-id={course.courseId}>
            <Td className="whitespace-nowrap">
              <Num className="font-medium">{course.code}</Num>
            </Td>
            <Td>{course.title}</Td>
            <Td>
              <RoleBadge role={course.role} />
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}

/** /: a greeting, the person's courses with their role on each, and what each of their roles can do here. */
export function DashboardPage() {
  const me = useCurrentUser();
  const roles = sortRoles(me.roles);
  const now = new Date();

  return (
    <>
      <title>Dashboard · Bondmark</title>
      <header className="mb-6 border-b border-rule pb-3">
        <h1 className="font-serif text-[1.75rem] leading-tight font-semibold" data-testid="greeting">
          {greetingFor(now.getHours())}, {me.displayName}
        </h1>
        <p className="mt-1 text-graphite">
          <Num>{formatDate(now.toISOString())}</Num>
          {roles.length ? ' · ' : null}
          {roles.length ? `Signed in as ${roles.map((r) => ROLE_ABILITIES[r].heading.replace(/^As /, '')).join(', ')}` : null}
        </p>
      </header>

      <div className="grid gap-8 xl:grid-cols-[minmax(0,3fr)_minmax(18rem,2fr)]">
        <section aria-labelledby="dashboard-courses-title">
          <h2 id="dashboard-courses-title" className="mb-2 font-serif text-xl font-semibold">
            Your courses
          </h2>
          <MyCourses me={me} />
        </section>

        <section aria-labelledby="dashboard-roles-title">
          <h2 id="dashboard-roles-title" className="mb-2 font-serif text-xl font-semibold">
            What you can do here
          </h2>
          {roles.length === 0 ? (
            <p className="text-graphite">
              Your account has no role yet. A lecturer or the department admin gives you one by adding you to a course.
            </p>
          ) : (
            <div className="grid gap-3 sm:grid-cols-2 xl:grid-cols-1">
              {roles.map((role) => (
                <div key={role} className="rounded-[3px] border border-rule bg-sheet px-4 py-3" data-testid={`abilities-${role}`}>
                  <h3 className="mb-1.5 flex items-center gap-2 font-semibold">
                    <RoleBadge role={role} />
                    <span className="sr-only">{ROLE_ABILITIES[role].heading}</span>
                  </h3>
                  <ul className="space-y-1 text-[0.92rem]">
                    {ROLE_ABILITIES[role].abilities.map((ability) => (
                      <li key={ability.text} className="flex gap-2">
                        <span aria-hidden="true" className="text-rule-strong">
                          –
                        </span>
                        {ability.to ? <Link to={ability.to}>{ability.text}</Link> : <span>{ability.text}</span>}
                      </li>
                    ))}
                  </ul>
                </div>
              ))}
            </div>
          )}
        </section>
      </div>
    </>
  );
}
