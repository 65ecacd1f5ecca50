import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AdminUserRow } from '@shared/api';
import { apiGet } from '@client/lib/api';

export const adminUsersQueryKey = ['admin', 'users'] as const;

/** GET /api/v1/admin/users (admin only): everyone who has a Bondmark account. */
export const adminUsersQueryOptions = () =>
  queryOptions({
    queryKey: adminUsersQueryKey,
    queryFn: ({ signal }) => apiGet<{ users: AdminUserRow[] }>('/api/v1/admin/users', { signal }),
    select: (data) => data.users,
  });

export function useAdminUsers() {
  return useQuery(adminUsersQueryOptions());
}
