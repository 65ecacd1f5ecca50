import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JobProgress } from '@shared/api/reports';
import { apiGet } from '@client/lib/api';
import { reportsKeys } from './keys';

/** GET /api/v1/jobs/:id, polled every second while the job is queued or running. */
export const jobQueryOptions = (jobId: number) =>
  queryOptions({
    queryKey: reportsKeys.job(jobId),
    queryFn: ({ signal }) => apiGet<JobProgress>(`/api/v1/jobs/${jobId}`, { signal }),
    refetchInterval: (query) => (query.state.data && (query.state.data.state === 'done' || query.state.data.state === 'failed') ? false : 1000),
  });

export function useJob(jobId: number | null | undefined) {
  return useQuery({ ...jobQueryOptions(jobId ?? 0), enabled: Boolean(jobId) });
}
