import { useOutletContext } from 'react-router';
import type { CourseDetail } from '@shared/api/courses';

/**
 * Inside /courses/:courseId/* the course page passes the loaded course to its
 * child routes (Sections, Roster, Exercises, Settings) through <Outlet context>.
 */
export interface CourseOutletContext {
  course: CourseDetail;
}

export function useCourseFromLayout(): CourseDetail {
  return useOutletContext<CourseOutletContext>().course;
}
