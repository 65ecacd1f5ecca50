import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ExercisesResponse } from '@shared/api/exercises';
import { apiGet } from '@client/lib/api';

export const exercisesKeys = {
  all: ['exercises'] as const,
  ofCourse: (courseId: number) => ['exercises', 'course', courseId] as const,
  one: (id: number) => ['exercises', 'one', id] as const,
  answerKey: (id: number) => ['exercises', 'one', id, 'answer-key'] as const,
  preview: (id: number, studentNumber: string) => ['exercises', 'one', id, 'preview', studentNumber] as const,
};

/** GET /api/v1/courses/:courseId/exercises: staff see every state, students published and closed ones. */
export const courseExercisesQueryOptions = (courseId: number) =>
  queryOptions({
    queryKey: exercisesKeys.ofCourse(courseId),
    queryFn: ({ signal }) => apiGet<ExercisesResponse>(`/api/v1/courses/${courseId}/exercises`, { signal }),
  });

export function useCourseExercises(courseId: number) {
  return useQuery(courseExercisesQueryOptions(courseId));
}
