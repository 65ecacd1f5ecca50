import { useMutation } from '@tanstack/react-query';
import type { z } from 'zod';
import type { logoutResponseSchema } from '@shared/api';
import { apiPost } from '@client/lib/api';

type LogoutResponse = z.infer<typeof logoutResponseSchema>;

/** POST /auth/logout, then leave the app for the address the server names (the provider's end-session page). */
export async function signOut(): Promise<LogoutResponse> {
  return apiPost<LogoutResponse>('/auth/logout');
}

export function useSignOut() {
  return useMutation({
    mutationFn: signOut,
    onSuccess: ({ redirect }) => {
      window.location.assign(redirect || '/signin');
    },
  });
}
