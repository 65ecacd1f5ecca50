import { MutationCache, QueryCache, QueryClient, type Query } from '@tanstack/react-query';
import { ApiError } from './api-error';

/**
 * What to do when the server says the session is gone (401) while the person
 * is using the app. The router registers the real handler (a navigation to
 * /signin?returnTo=...); until then nothing happens.
 */
let onSessionLost: () => void | Promise<void> = () => {};
export function setSessionLostHandler(handler: () => void | Promise<void>): void {
  onSessionLost = handler;
}

/** Query keys that are allowed to fail with 401 without sending the person to sign-in. */
export type QueryMeta = { quietUnauthenticated?: boolean };

function isUnauthenticated(error: unknown): boolean {
  return error instanceof ApiError && error.status === 401;
}

function handleQueryError(error: unknown, query: Query<unknown, unknown, unknown>): void {
  if (!isUnauthenticated(error)) return;
  // The route loaders decide what a first, data-less 401 means (e.g. /me on a cold start).
  const meta = query.meta as QueryMeta | undefined;
  if (meta?.quietUnauthenticated && query.state.data === undefined) return;
  void onSessionLost();
}

export function createQueryClient(): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({ onError: handleQueryError }),
    mutationCache: new MutationCache({
      onError: (error) => {
        if (isUnauthenticated(error)) void onSessionLost();
      },
    }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        // A 4xx will not change by asking again; network trouble and 5xx might.
        retry: (failureCount, error) => {
          if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
          return failureCount < 2;
        },
        refetchOnWindowFocus: true,
      },
      mutations: { retry: false },
    },
  });
}

/** The one query client of the app; route loaders and the API client share it. */
export const queryClient = createQueryClient();
