import { Navigate } from 'react-router';
import { useCourseFromLayout } from '../lib/course-context';
import { courseTabs } from './course-layout';

/** /courses/:courseId: the first tab the caller has (Sections for staff, Exercises for students). */
export function CourseIndex() {
  const course = useCourseFromLayout();
  return <Navigate to={courseTabs(course)[0].to} replace />;
}
