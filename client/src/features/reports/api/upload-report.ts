import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ReadPreview, ReportChoice, UploadResult } from '@shared/api/reports';
import { withQuery } from '@client/lib/api';
import { sendWithProgress, type UploadProgress } from './send-upload';
import { reportsKeys } from './keys';

export interface UploadFiles {
  data: File;
  writeup?: File | null;
  choice?: ReportChoice;
}

function formOf(files: UploadFiles): FormData {
  const form = new FormData();
  form.append('data', files.data, files.data.name);
  if (files.writeup) form.append('writeup', files.writeup, files.writeup.name);
  if (files.choice) form.append('choice', JSON.stringify(files.choice));
  return form;
}

/** POST /api/v1/exercises/:id/reports/read: what was read, nothing stored. */
export function readReportFiles(exerciseId: number, files: UploadFiles, onProgress?: (p: UploadProgress) => void, enrolmentId?: number) {
  return sendWithProgress<ReadPreview>(withQuery(`/api/v1/exercises/${exerciseId}/reports/read`, { enrolmentId }), formOf(files), { onProgress });
}

/** POST /api/v1/exercises/:id/reports: stores a new version with the confirmed choice. */
export function uploadReportFiles(exerciseId: number, files: UploadFiles, onProgress?: (p: UploadProgress) => void, enrolmentId?: number) {
  return sendWithProgress<UploadResult>(withQuery(`/api/v1/exercises/${exerciseId}/reports`, { enrolmentId }), formOf(files), { onProgress });
}

export function useReadReport(exerciseId: number, enrolmentId?: number) {
  return useMutation({
    mutationFn: (args: { files: UploadFiles; onProgress?: (p: UploadProgress) => void }) => readReportFiles(exerciseId, args.files, args.onProgress, enrolmentId),
  });
}

export function useUploadReport(exerciseId: number, enrolmentId?: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (args: { files: UploadFiles; onProgress?: (p: UploadProgress) => void }) => uploadReportFiles(exerciseId, args.files, args.onProgress, enrolmentId),
    onSuccess: () => {
      void queryClient.invalidateQueries({ queryKey: reportsKeys.exercise(exerciseId) });
      void queryClient.invalidateQueries({ queryKey: ['my-exercises'] });
    },
  });
}
