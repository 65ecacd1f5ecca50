import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AnswerKeyResponse, ExerciseResponse, PreviewResponse } from '@shared/api/exercises';
import { apiGet } from '@client/lib/api';
import { exercisesKeys } from './get-exercises';

/** GET /api/v1/exercises/:id: staff get the whole spec and revisions, students what they hand in against. */
export const exerciseQueryOptions = (id: number) =>
  queryOptions({
    queryKey: exercisesKeys.one(id),
    queryFn: ({ signal }) => apiGet<ExerciseResponse>(`/api/v1/exercises/${id}`, { signal }),
  });

export function useExercise(id: number) {
  return useQuery(exerciseQueryOptions(id));
}

/** GET /api/v1/exercises/:id/answer-key: every variant's answer key and who holds it (staff). */
export const answerKeyQueryOptions = (id: number) =>
  queryOptions({
    queryKey: exercisesKeys.answerKey(id),
    queryFn: ({ signal }) => apiGet<AnswerKeyResponse>(`/api/v1/exercises/${id}/answer-key`, { signal }),
    staleTime: 60_000,
  });

export function useAnswerKey(id: number, enabled: boolean) {
  return useQuery({ ...answerKeyQueryOptions(id), enabled });
}

/** GET /api/v1/exercises/:id/preview?studentNumber=: one student's variant (staff). */
export function usePreview(id: number, studentNumber: string, enabled: boolean) {
  return useQuery({
    queryKey: exercisesKeys.preview(id, studentNumber),
    queryFn: ({ signal }) => apiGet<PreviewResponse>(`/api/v1/exercises/${id}/preview`, { signal, query: { studentNumber } }),
    enabled: enabled && studentNumber.length > 0,
  });
}
