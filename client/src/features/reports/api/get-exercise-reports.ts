import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExerciseReports } from '@shared/api/reports';
import { apiGet } from '@client/lib/api';
import { reportsKeys } from './keys';

/** GET /api/v1/exercises/:id/reports: the exercise's due date and one student's versions, newest first. */
export const exerciseReportsQueryOptions = (exerciseId: number, enrolmentId?: number) =>
  queryOptions({
    queryKey: reportsKeys.versions(exerciseId, enrolmentId),
    queryFn: ({ signal }) => apiGet<ExerciseReports>(`/api/v1/exercises/${exerciseId}/reports`, { signal, query: { enrolmentId } }),
  });

export function useExerciseReports(exerciseId: number, enrolmentId?: number) {
  return useQuery(exerciseReportsQueryOptions(exerciseId, enrolmentId));
}
