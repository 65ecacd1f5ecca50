import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MyExercisesResponse } from '@shared/api/templates';
import { apiGet } from '@client/lib/api';

export const myExercisesQueryKey = ['my-exercises', 'list'] as const;

/** GET /api/v1/my/exercises: the published exercises of the courses the caller is a student of. */
export const myExercisesQueryOptions = () =>
  queryOptions({
    queryKey: myExercisesQueryKey,
    queryFn: ({ signal }) => apiGet<MyExercisesResponse>('/api/v1/my/exercises', { signal }),
    // the window (open / late / closed) moves with the clock
    refetchInterval: 5 * 60_000,
  });

export function useMyExercises() {
  return useQuery(myExercisesQueryOptions());
}
