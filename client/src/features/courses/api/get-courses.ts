import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CourseSummary } from '@shared/api';
import { apiGet } from '@client/lib/api';

export const coursesQueryKey = ['courses', 'list'] as const;

/** GET /api/v1/courses: the courses the caller may see (the server filters by role and scope). */
export const coursesQueryOptions = () =>
  queryOptions({
    queryKey: coursesQueryKey,
    queryFn: ({ signal }) => apiGet<{ courses: CourseSummary[] }>('/api/v1/courses', { signal }),
    select: (data) => data.courses,
  });

export function useCourses() {
  return useQuery(coursesQueryOptions());
}
