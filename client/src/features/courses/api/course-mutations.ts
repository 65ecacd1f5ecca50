import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AddStaffBody, CourseDetail, CreateCourseBody, StaffRole, UpdateCourseBody } from '@shared/api/courses';
import { apiFetch, apiPost } from '@client/lib/api';
import { meQueryKey } from '@client/features/session/api/get-me';
import { courseQueryKey } from './get-course';

/** Every change to a course refreshes the course list, the course itself (['courses', ...]) and /me. */
function useCourseMutation<TVars>(fn: (vars: TVars) => Promise<CourseDetail>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: (course) => {
      queryClient.setQueryData(courseQueryKey(course.id), course);
      // the dashboard and navigation read the person's courses and roles from /me
      return Promise.all([queryClient.invalidateQueries({ queryKey: ['courses'] }), queryClient.invalidateQueries({ queryKey: meQueryKey })]);
    },
  });
}

/** POST /api/v1/courses */
export const useCreateCourse = () => useCourseMutation((body: CreateCourseBody) => apiPost<CourseDetail>('/api/v1/courses', body));

/** PATCH /api/v1/courses/:courseId */
export const useUpdateCourse = (courseId: number) =>
  useCourseMutation((body: UpdateCourseBody) => apiFetch<CourseDetail>(`/api/v1/courses/${courseId}`, { method: 'PATCH', body }));

/** POST /api/v1/courses/:courseId/archive or /restore */
export const useSetCourseArchived = (courseId: number) =>
  useCourseMutation((archived: boolean) => apiPost<CourseDetail>(`/api/v1/courses/${courseId}/${archived ? 'archive' : 'restore'}`));

/** POST /api/v1/courses/:courseId/staff */
export const useAddStaff = (courseId: number) =>
  useCourseMutation((body: AddStaffBody) => apiPost<CourseDetail>(`/api/v1/courses/${courseId}/staff`, body));

/** DELETE /api/v1/courses/:courseId/staff/:userId/:role */
export const useRemoveStaff = (courseId: number) =>
  useCourseMutation(({ userId, role }: { userId: number; role: StaffRole }) =>
    apiFetch<CourseDetail>(`/api/v1/courses/${courseId}/staff/${userId}/${role}`, { method: 'DELETE' }),
  );
