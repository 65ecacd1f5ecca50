import { queryOptions, useQuery } from '@tanstack/react-query';
import type { SimilarityFlag } from '@shared/api/reports';
import { apiGet } from '@client/lib/api';
import { reportsKeys } from './keys';

/** GET /api/v1/exercises/:id/similarity-flags (staff): flags for a person to look at; they never change marks. */
export const similarityFlagsQueryOptions = (exerciseId: number) =>
  queryOptions({
    queryKey: reportsKeys.similarity(exerciseId),
    queryFn: ({ signal }) => apiGet<{ flags: SimilarityFlag[] }>(`/api/v1/exercises/${exerciseId}/similarity-flags`, { signal }),
    select: (data) => data.flags,
  });

export function useSimilarityFlags(exerciseId: number) {
  return useQuery(similarityFlagsQueryOptions(exerciseId));
}
