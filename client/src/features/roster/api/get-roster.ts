import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AddStudentBody, RosterEntry, RosterImportRecord } from '@shared/api/roster';
import { apiFetch, apiGet, apiPost } from '@client/lib/api';
import { sectionsQueryKey } from '@client/features/sections/api/get-sections';

export const rosterQueryKey = (courseId: number) => ['roster', courseId] as const;

/** GET /api/v1/courses/:courseId/roster: everyone (lecturers) or the students of an assistant's sections. */
export const rosterQueryOptions = (courseId: number) =>
  queryOptions({
    queryKey: rosterQueryKey(courseId),
    queryFn: ({ signal }) => apiGet<{ entries: RosterEntry[]; readOnly: boolean }>(`/api/v1/courses/${courseId}/roster`, { signal }),
  });

export function useRoster(courseId: number) {
  return useQuery(rosterQueryOptions(courseId));
}

/** GET /api/v1/courses/:courseId/roster/imports (lecturers): the applied imports, newest first. */
export const rosterImportsQueryOptions = (courseId: number) =>
  queryOptions({
    queryKey: [...rosterQueryKey(courseId), 'imports'] as const,
    queryFn: ({ signal }) => apiGet<{ imports: RosterImportRecord[] }>(`/api/v1/courses/${courseId}/roster/imports`, { signal }),
    select: (data) => data.imports,
  });

export function useRosterImports(courseId: number, enabled: boolean) {
  return useQuery({ ...rosterImportsQueryOptions(courseId), enabled });
}

/** After any roster change: the roster, the sections' student counts and the course list's counts. */
export function useInvalidateRoster(courseId: number) {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: rosterQueryKey(courseId) }),
      queryClient.invalidateQueries({ queryKey: sectionsQueryKey(courseId) }),
      queryClient.invalidateQueries({ queryKey: ['courses'] }),
    ]);
}

function useEntryMutation<TVars>(courseId: number, fn: (vars: TVars) => Promise<RosterEntry>) {
  const invalidate = useInvalidateRoster(courseId);
  return useMutation({ mutationFn: fn, onSuccess: invalidate });
}

/** POST /api/v1/courses/:courseId/roster/students */
export const useAddStudent = (courseId: number) =>
  useEntryMutation(courseId, (body: AddStudentBody) => apiPost<RosterEntry>(`/api/v1/courses/${courseId}/roster/students`, body));

/** PATCH /api/v1/courses/:courseId/roster/:enrolmentId { sectionId } */
export const useMoveStudent = (courseId: number) =>
  useEntryMutation(courseId, ({ enrolmentId, sectionId }: { enrolmentId: number; sectionId: number | null }) =>
    apiFetch<RosterEntry>(`/api/v1/courses/${courseId}/roster/${enrolmentId}`, { method: 'PATCH', body: { sectionId } }),
  );

/** POST .../roster/:enrolmentId/withdraw or /reinstate */
export const useSetWithdrawn = (courseId: number) =>
  useEntryMutation(courseId, ({ enrolmentId, withdrawn }: { enrolmentId: number; withdrawn: boolean }) =>
    apiPost<RosterEntry>(`/api/v1/courses/${courseId}/roster/${enrolmentId}/${withdrawn ? 'withdraw' : 'reinstate'}`),
  );
