import type { CurrentUser } from '@shared/api';

export type Role = CurrentUser['roles'][number];

/** Display order: widest scope first. */
export const ROLE_ORDER: readonly Role[] = ['admin', 'lecturer', 'assistant', 'student'];

export const ROLE_LABEL: Record<Role, string> = {
  admin: 'Admin',
  lecturer: 'Lecturer',
  assistant: 'Assistant',
  student: 'Student',
};

export function sortRoles(roles: readonly Role[]): Role[] {
  return ROLE_ORDER.filter((role) => roles.includes(role));
}

export function hasRole(user: Pick<CurrentUser, 'roles' | 'isAdmin'>, role: Role): boolean {
  return role === 'admin' ? user.isAdmin || user.roles.includes('admin') : user.roles.includes(role);
}

/** Teaches or runs something: sees the staff side of courses. */
export function isStaff(user: Pick<CurrentUser, 'roles' | 'isAdmin'>): boolean {
  return hasRole(user, 'admin') || hasRole(user, 'lecturer') || hasRole(user, 'assistant');
}
