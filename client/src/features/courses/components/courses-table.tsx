import { Link } from 'react-router';
import type { CourseSummary } from '@shared/api';
import { Num } from '@client/components/ui/num';
import { RoleBadge } from '@client/components/ui/role-badge';
import { StatusText } from '@client/components/ui/status-text';
import { SkeletonRows, Table, Td, Th } from '@client/components/ui/table';
import { DateTime } from '@client/components/ui/date-time';
import { formatCount } from '@client/lib/format';

/** The course list: one row per course, dense, numbers in the number face. */
export function CoursesTable({
  courses,
  loading,
  showStudentCount,
}: {
  courses: CourseSummary[] | undefined;
  loading: boolean;
  showStudentCount: boolean;
}) {
  const columns = showStudentCount ? 7 : 6;
  return (
    <Table label="Courses" busy={loading} testId="courses-table">
      <thead>
        <tr>
          <Th>Code</Th>
          <Th>Title</Th>
          <Th>Term</Th>
          <Th>Your role</Th>
          <Th>Lecturers</Th>
          {showStudentCount ? <Th className="text-right">Students</Th> : null}
          <Th>State</Th>
        </tr>
      </thead>
      <tbody>
        {loading || !courses ? (
          <SkeletonRows columns={columns} rows={5} label="Loading courses" />
        ) : (
          courses.map((course) => (
            <tr key={course.id} data-testid="course-row" data-course-id={course.id} className="hover:bg-paper">
              <Td className="whitespace-nowrap">
                <Link to={`/courses/${course.id}`} className="font-medium">
                  <Num>{course.code}</Num>
                </Link>
              </Td>
              <Td className="min-w-[16rem]">
                <Link to={`/courses/${course.id}`} className="text-ink no-underline hover:underline">
                  {course.title}
                </Link>
              </Td>
              <Td className="whitespace-nowrap">
                <div>{course.term.name}</div>
                <div className="text-[0.8rem] text-graphite">
                  <DateTime iso={course.term.startsOn} dateOnly /> – <DateTime iso={course.term.endsOn} dateOnly />
                </div>
              </Td>
              <Td>
                {course.myRole ? (
                  <RoleBadge role={course.myRole} />
                ) : (
                  <span className="text-graphite" title="You see this course as a department admin">
                    Admin view
                  </span>
                )}
              </Td>
              <Td>
                {course.lecturers.length ? (
                  course.lecturers.map((l) => l.displayName).join(', ')
                ) : (
                  <span className="text-graphite">None yet</span>
                )}
              </Td>
              {showStudentCount ? (
                <Td className="text-right">
                  <Num>{formatCount(course.studentCount)}</Num>
                </Td>
              ) : null}
              <Td>
                {course.archived ? <StatusText tone="neutral">Archived</StatusText> : <StatusText tone="good">Running</StatusText>}
              </Td>
            </tr>
          ))
        )}
      </tbody>
    </Table>
  );
}
