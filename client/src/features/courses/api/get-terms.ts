import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { CreateTermBody, Term } from '@shared/api/courses';
import { apiGet, apiPost } from '@client/lib/api';

export const termsQueryKey = ['terms'] as const;

/** GET /api/v1/terms (admins and lecturers): every term, newest first. */
export const termsQueryOptions = () =>
  queryOptions({
    queryKey: termsQueryKey,
    queryFn: ({ signal }) => apiGet<{ terms: Term[] }>('/api/v1/terms', { signal }),
    select: (data) => data.terms,
  });

export function useTerms() {
  return useQuery(termsQueryOptions());
}

/** POST /api/v1/terms (admins). */
export function useCreateTerm() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateTermBody) => apiPost<Term>('/api/v1/terms', body),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: termsQueryKey }),
  });
}
