import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CourseDetail } from '@shared/api/courses';
import { apiGet } from '@client/lib/api';

export const courseQueryKey = (courseId: number) => ['courses', 'detail', courseId] as const;

/** GET /api/v1/courses/:courseId: the course, its teaching team and what the caller may do in it. */
export const courseQueryOptions = (courseId: number) =>
  queryOptions({
    queryKey: courseQueryKey(courseId),
    queryFn: ({ signal }) => apiGet<CourseDetail>(`/api/v1/courses/${courseId}`, { signal }),
  });

export function useCourse(courseId: number) {
  return useQuery(courseQueryOptions(courseId));
}
