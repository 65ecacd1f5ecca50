import { infiniteQueryOptions, useInfiniteQuery } from '@tanstack/react-query';
import type { AuditEntry } from '@shared/api';
import { apiGet } from '@client/lib/api';

export const AUDIT_PAGE_SIZE = 50;

export const auditQueryKey = ['admin', 'audit'] as const;

interface AuditPage {
  entries: AuditEntry[];
  nextBefore: number | null;
}

/**
 * GET /api/v1/admin/audit?limit=50&before=<id> (admin only), newest first.
 * Each page names the id to ask "before" for the next, older page.
 */
export const auditQueryOptions = (limit = AUDIT_PAGE_SIZE) =>
  infiniteQueryOptions({
    queryKey: [...auditQueryKey, { limit }] as const,
    queryFn: ({ pageParam, signal }) =>
      apiGet<AuditPage>('/api/v1/admin/audit', { signal, query: { limit, before: pageParam } }),
    initialPageParam: null as number | null,
    getNextPageParam: (last) => last.nextBefore ?? undefined,
  });

export function useAuditLog(limit = AUDIT_PAGE_SIZE) {
  return useInfiniteQuery(auditQueryOptions(limit));
}
