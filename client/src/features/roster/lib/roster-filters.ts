import type { RosterEntry } from '@shared/api/roster';

/** Column ids of the roster table; also the values of `sort` in the URL. */
export const ROSTER_COLUMN_IDS = ['studentNumber', 'familyName', 'givenName', 'email', 'section', 'status'] as const;

export interface RosterFilters {
  /** free text: number, names or e-mail */
  q: string;
  /** a section id, 'none' (no section) or '' (all) */
  section: string;
  /** 'active', 'withdrawn' or '' (all) */
  status: string;
}

export function readRosterFilters(params: URLSearchParams): RosterFilters {
  return { q: params.get('q') ?? '', section: params.get('section') ?? '', status: params.get('status') ?? '' };
}

/** Section and status filters (the text filter is the table's global filter). */
export function filterRoster(entries: RosterEntry[], filters: Pick<RosterFilters, 'section' | 'status'>): RosterEntry[] {
  return entries.filter((e) => {
    if (filters.status && e.status !== filters.status) return false;
    if (filters.section === 'none') return e.section === null;
    if (filters.section) return e.section?.id === Number(filters.section);
    return true;
  });
}

/** Does a roster entry match the text filter (number, names, e-mail; case ignored)? */
export function matchesText(entry: RosterEntry, needle: string): boolean {
  const n = needle.trim().toLowerCase();
  if (!n) return true;
  return [entry.studentNumber, entry.familyName, entry.givenName, entry.email, `${entry.givenName ?? ''} ${entry.familyName ?? ''}`]
    .filter(Boolean)
    .some((v) => String(v).toLowerCase().includes(n));
}
