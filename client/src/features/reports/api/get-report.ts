import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ReportDetail } from '@shared/api/reports';
import { apiGet } from '@client/lib/api';
import { reportsKeys } from './keys';

/** GET /api/v1/reports/:id: the report with its reading, checks and overlay (students: once returned). */
export const reportQueryOptions = (reportId: number) =>
  queryOptions({
    queryKey: reportsKeys.detail(reportId),
    queryFn: ({ signal }) => apiGet<ReportDetail>(`/api/v1/reports/${reportId}`, { signal }),
  });

export function useReport(reportId: number) {
  return useQuery(reportQueryOptions(reportId));
}
