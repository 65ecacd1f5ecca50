/**
 * Table sorting in the URL: `sort=name` (ascending) or `sort=-lastSignIn`
 * (descending), so that a sorted, filtered view can be bookmarked and shared.
 */
export interface SortState {
  id: string;
  desc: boolean;
}

/** Reads `sort` from the URL; unknown column ids are ignored. */
export function parseSort(value: string | null, allowedIds: readonly string[]): SortState[] {
  if (!value) return [];
  const desc = value.startsWith('-');
  const id = desc ? value.slice(1) : value;
  return allowedIds.includes(id) ? [{ id, desc }] : [];
}

/** The `sort` value for a sorting state, or null when the table is unsorted. */
export function formatSort(sorting: readonly SortState[]): string | null {
  const first = sorting[0];
  if (!first) return null;
  return `${first.desc ? '-' : ''}${first.id}`;
}

/** Copy of `params` with `key` set, or removed when value is null or empty. */
export function withParam(params: URLSearchParams, key: string, value: string | null): URLSearchParams {
  const next = new URLSearchParams(params);
  if (value === null || value === '') next.delete(key);
  else next.set(key, value);
  return next;
}
