import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ExerciseMutationResponse } from '@shared/api/exercises';
import type { ExerciseSpecInput } from '@shared/exercises/spec';
import { apiFetch, apiPost } from '@client/lib/api';
import { exercisesKeys } from './get-exercises';

function useAfterChange() {
  const client = useQueryClient();
  return (data: ExerciseMutationResponse) => {
    client.setQueryData(exercisesKeys.one(data.exercise.id), data.exercise);
    void client.invalidateQueries({ queryKey: exercisesKeys.ofCourse(data.exercise.course.id) });
    void client.invalidateQueries({ queryKey: exercisesKeys.answerKey(data.exercise.id) });
    void client.invalidateQueries({ queryKey: [...exercisesKeys.one(data.exercise.id), 'preview'] });
  };
}

/** POST /api/v1/courses/:courseId/exercises → a draft. */
export function useCreateExercise(courseId: number) {
  const after = useAfterChange();
  return useMutation({
    mutationFn: (spec: ExerciseSpecInput) => apiPost<ExerciseMutationResponse>(`/api/v1/courses/${courseId}/exercises`, spec),
    onSuccess: after,
  });
}

/** PUT /api/v1/exercises/:id; a published exercise needs `remark: true` (else 409 conflict). */
export function useUpdateExercise(id: number) {
  const after = useAfterChange();
  return useMutation({
    mutationFn: ({ spec, remark }: { spec: ExerciseSpecInput; remark?: boolean }) =>
      apiFetch<ExerciseMutationResponse>(`/api/v1/exercises/${id}`, { method: 'PUT', body: remark ? { ...spec, remark: true } : spec }),
    onSuccess: after,
  });
}

/** POST /api/v1/exercises/:id/publish or /close. */
export function useExerciseTransition(id: number) {
  const after = useAfterChange();
  return useMutation({
    mutationFn: (to: 'publish' | 'close') => apiPost<ExerciseMutationResponse>(`/api/v1/exercises/${id}/${to}`),
    onSuccess: after,
  });
}
