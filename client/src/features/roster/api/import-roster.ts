import { useMutation } from '@tanstack/react-query';
import type { RosterApplyResult, RosterMapping, RosterPreview } from '@shared/api/roster';
import { apiPost } from '@client/lib/api';
import { useInvalidateRoster } from './get-roster';

function form(file: File, fields: Record<string, string | undefined>): FormData {
  const data = new FormData();
  data.set('file', file, file.name);
  for (const [key, value] of Object.entries(fields)) if (value !== undefined) data.set(key, value);
  return data;
}

/** POST /api/v1/courses/:courseId/roster/preview (multipart): writes nothing. */
export function usePreviewRoster(courseId: number) {
  return useMutation({
    mutationFn: ({ file, mapping }: { file: File; mapping?: RosterMapping }) =>
      apiPost<RosterPreview>(`/api/v1/courses/${courseId}/roster/preview`, form(file, { mapping: mapping && JSON.stringify(mapping) })),
  });
}

/** POST /api/v1/courses/:courseId/roster/apply (multipart): the same file, the confirmed mapping, the preview's SHA-256. */
export function useApplyRoster(courseId: number) {
  const invalidate = useInvalidateRoster(courseId);
  return useMutation({
    mutationFn: ({ file, mapping, sha256 }: { file: File; mapping: RosterMapping; sha256: string }) =>
      apiPost<RosterApplyResult>(`/api/v1/courses/${courseId}/roster/apply`, form(file, { mapping: JSON.stringify(mapping), sha256 })),
    onSuccess: invalidate,
  });
}
