/** Query keys of the reports feature, in one place so that invalidation is one line. */
export const reportsKeys = {
  all: ['reports'] as const,
  exercise: (exerciseId: number) => ['reports', 'exercise', exerciseId] as const,
  versions: (exerciseId: number, enrolmentId: number | undefined) => ['reports', 'exercise', exerciseId, 'versions', enrolmentId ?? 'mine'] as const,
  detail: (reportId: number) => ['reports', 'detail', reportId] as const,
  similarity: (exerciseId: number) => ['reports', 'exercise', exerciseId, 'similarity-flags'] as const,
  job: (jobId: number) => ['jobs', jobId] as const,
};
