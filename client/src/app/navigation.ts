import type { CurrentUser } from '@shared/api';
import { hasRole, isStaff } from '@client/features/session/lib/roles';

export interface NavItem {
  to: string;
  /** The link's visible text and its accessible name; browser tests click these. */
  label: 'Dashboard' | 'Courses' | 'My courses' | 'My exercises' | 'Reference explorer' | 'People' | 'Audit log';
  /** Match the path exactly (the dashboard would otherwise be "active" everywhere). */
  end?: boolean;
}

/** The left navigation for one person, from the roles the server reports. */
export function navigationFor(user: Pick<CurrentUser, 'roles' | 'isAdmin'>): NavItem[] {
  const items: NavItem[] = [{ to: '/', label: 'Dashboard', end: true }];
  if (isStaff(user)) items.push({ to: '/courses', label: 'Courses' });
  else if (hasRole(user, 'student')) items.push({ to: '/courses', label: 'My courses' });
  // anyone on a roster (an assistant may be a student on another course) fetches templates here
  if (hasRole(user, 'student')) items.push({ to: '/my/exercises', label: 'My exercises' });
  if (isStaff(user)) items.push({ to: '/explorer', label: 'Reference explorer' });
  if (hasRole(user, 'admin')) {
    items.push({ to: '/admin/people', label: 'People' });
    items.push({ to: '/admin/audit', label: 'Audit log' });
  }
  return items;
}
