import { redirect } from 'react-router';
import type { CurrentUser } from '@shared/api';
import { ApiError } from '@client/lib/api';
import { queryClient } from '@client/lib/query-client';
import { meQueryOptions } from '../api/get-me';
import { signInPath } from './return-to';

/**
 * For route loaders: the signed-in person, or a redirect to
 * /signin?returnTo=<the requested path> when /me answers 401.
 */
export async function requireMe(request: Request): Promise<CurrentUser> {
  try {
    return await queryClient.ensureQueryData(meQueryOptions());
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) {
      const url = new URL(request.url);
      throw redirect(signInPath(url.pathname + url.search));
    }
    throw error;
  }
}

/** For admin-only route loaders: as requireMe, and a 403 for everyone else. */
export async function requireAdmin(request: Request): Promise<CurrentUser> {
  const me = await requireMe(request);
  if (!me.isAdmin) {
    throw new ApiError(403, 'forbidden', 'This page is for department administrators.');
  }
  return me;
}
