import { queryOptions, useQuery, useSuspenseQuery } from '@tanstack/react-query';
import type { CurrentUser } from '@shared/api';
import { apiGet } from '@client/lib/api';
import type { QueryMeta } from '@client/lib/query-client';

export const meQueryKey = ['session', 'me'] as const;

/** GET /api/v1/me: the signed-in person, or ApiError 401 'unauthenticated'. */
export const meQueryOptions = () =>
  queryOptions({
    queryKey: meQueryKey,
    queryFn: ({ signal }) => apiGet<CurrentUser>('/api/v1/me', { signal }),
    staleTime: 5 * 60_000,
    // A cold-start 401 is handled by the route loader (redirect to /signin).
    meta: { quietUnauthenticated: true } satisfies QueryMeta,
  });

/** The signed-in person. Inside the signed-in layout the loader has already filled the cache. */
export function useMe() {
  return useQuery(meQueryOptions());
}

/**
 * The signed-in person inside the signed-in layout, never undefined: the
 * layout's loader (requireMe) has put it in the cache before any page renders.
 */
export function useCurrentUser(): CurrentUser {
  return useSuspenseQuery(meQueryOptions()).data;
}
