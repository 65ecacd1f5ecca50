import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateSectionBody, Section, UpdateSectionBody } from '@shared/api/sections';
import { apiFetch, apiGet, apiPost } from '@client/lib/api';
import { courseQueryKey } from '@client/features/courses/api/get-course';

export const sectionsQueryKey = (courseId: number) => ['sections', courseId] as const;

/** GET /api/v1/courses/:courseId/sections: all sections for lecturers; an assistant's own for assistants. */
export const sectionsQueryOptions = (courseId: number) =>
  queryOptions({
    queryKey: sectionsQueryKey(courseId),
    queryFn: ({ signal }) => apiGet<{ sections: Section[] }>(`/api/v1/courses/${courseId}/sections`, { signal }),
    select: (data) => data.sections,
  });

export function useSections(courseId: number) {
  return useQuery(sectionsQueryOptions(courseId));
}

function useSectionMutation<TVars>(courseId: number, fn: (vars: TVars) => Promise<Section>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: fn,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: sectionsQueryKey(courseId) }),
        queryClient.invalidateQueries({ queryKey: courseQueryKey(courseId) }),
      ]),
  });
}

/** POST /api/v1/courses/:courseId/sections */
export const useCreateSection = (courseId: number) =>
  useSectionMutation(courseId, (body: CreateSectionBody) => apiPost<Section>(`/api/v1/courses/${courseId}/sections`, body));

/** PATCH /api/v1/courses/:courseId/sections/:sectionId */
export const useUpdateSection = (courseId: number) =>
  useSectionMutation(courseId, ({ sectionId, body }: { sectionId: number; body: UpdateSectionBody }) =>
    apiFetch<Section>(`/api/v1/courses/${courseId}/sections/${sectionId}`, { method: 'PATCH', body }),
  );

/** POST .../sections/:sectionId/archive or /restore */
export const useSetSectionArchived = (courseId: number) =>
  useSectionMutation(courseId, ({ sectionId, archived }: { sectionId: number; archived: boolean }) =>
    apiPost<Section>(`/api/v1/courses/${courseId}/sections/${sectionId}/${archived ? 'archive' : 'restore'}`),
  );
