import type { Knex } from 'knex';
import type { CourseSummary } from '@shared/api/courses';
import { lecturersOf, myRoles, studentCounts, visibleCourses } from './repo';

const day = (d: Date | string) => (d instanceof Date ? d.toISOString().slice(0, 10) : String(d).slice(0, 10));
const rank: Record<string, number> = { lecturer: 0, assistant: 1, student: 2 };

export async function coursesFor(db: Knex, user: { id: number; isAdmin: boolean }): Promise<CourseSummary[]> {
  const rows = await visibleCourses(db, user.id, user.isAdmin);
  const ids = rows.map((r) => r.id);
  const [lecturers, counts, roles] = await Promise.all([lecturersOf(db, ids), studentCounts(db, ids), myRoles(db, user.id, ids)]);
  return rows.map((r) => {
    const mine = roles.filter((x) => x.course_id === r.id).sort((a, b) => rank[a.role] - rank[b.role]);
    return {
      id: r.id,
      code: r.code,
      title: r.title,
      term: { id: r.term_id, name: r.term_name, startsOn: day(r.starts_on), endsOn: day(r.ends_on) },
      myRole: (mine[0]?.role as CourseSummary['myRole']) ?? null,
      lecturers: lecturers.filter((l) => l.course_id === r.id).map((l) => ({ id: l.id, displayName: l.display_name })),
      studentCount: Number(counts.find((c) => c.course_id === r.id)?.n ?? 0),
      archived: Boolean(r.archived),
    };
  });
}
