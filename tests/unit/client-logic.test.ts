import { describe, expect, it } from 'vitest';
import { navigationFor } from '@client/app/navigation';
import { loginUrl, safeReturnTo, signInPath } from '@client/features/session/lib/return-to';
import { isStaff, sortRoles } from '@client/features/session/lib/roles';
import { compactChange, shortJson } from '@client/features/admin/lib/compact-change';
import { formatSort, parseSort, withParam } from '@client/lib/table-url';
import { formatCount, formatDate } from '@client/lib/format';

type Roles = ('admin' | 'lecturer' | 'assistant' | 'student')[];
const person = (roles: Roles) => ({ roles, isAdmin: roles.includes('admin') });
const labels = (roles: Roles) => navigationFor(person(roles)).map((item) => `${item.label} ${item.to}`);

describe('navigationFor', () => {
  it('gives a student Dashboard, My courses and My exercises only', () => {
    expect(labels(['student'])).toEqual(['Dashboard /', 'My courses /courses', 'My exercises /my/exercises']);
  });
  it('gives lecturers and assistants Courses and the explorer, without admin pages', () => {
    expect(labels(['lecturer'])).toEqual(['Dashboard /', 'Courses /courses', 'Reference explorer /explorer']);
    // an assistant who is a student elsewhere also fetches templates
    expect(labels(['assistant', 'student'])).toEqual(['Dashboard /', 'Courses /courses', 'My exercises /my/exercises', 'Reference explorer /explorer']);
  });
  it('gives admins People and Audit log', () => {
    expect(labels(['admin'])).toEqual([
      'Dashboard /',
      'Courses /courses',
      'Reference explorer /explorer',
      'People /admin/people',
      'Audit log /admin/audit',
    ]);
  });
  it('trusts isAdmin even when roles omit admin', () => {
    expect(navigationFor({ roles: [], isAdmin: true }).map((i) => i.label)).toContain('People');
  });
  it('gives someone without roles the dashboard only', () => {
    expect(labels([])).toEqual(['Dashboard /']);
  });
});

describe('roles', () => {
  it('orders roles from widest scope down and knows who is staff', () => {
    expect(sortRoles(['student', 'admin', 'assistant'])).toEqual(['admin', 'assistant', 'student']);
    expect(isStaff(person(['student']))).toBe(false);
    expect(isStaff(person(['assistant']))).toBe(true);
  });
});

describe('returnTo handling', () => {
  it('keeps same-origin paths with their search', () => {
    expect(safeReturnTo('/admin/people?q=ma&sort=-name')).toBe('/admin/people?q=ma&sort=-name');
  });
  it('refuses other origins, schemes, the sign-in page and auth routes', () => {
    for (const bad of ['//evil.example/x', 'https://evil.example', 'javascript:alert(1)', '/\\evil', '/signin?returnTo=/x', '/auth/logout', 'courses', '', null]) {
      expect(safeReturnTo(bad)).toBe('/');
    }
  });
  it('builds the sign-in screen and login addresses', () => {
    expect(signInPath('/courses?x=1')).toBe('/signin?returnTo=%2Fcourses%3Fx%3D1');
    expect(signInPath('/')).toBe('/signin');
    expect(loginUrl('/admin/audit')).toBe('/auth/login?returnTo=%2Fadmin%2Faudit');
    expect(loginUrl('//evil.example')).toBe('/auth/login?returnTo=%2F');
  });
});

describe('table sort in the URL', () => {
  const ids = ['name', 'lastSignIn'];
  it('reads ascending, descending and ignores unknown columns', () => {
    expect(parseSort('name', ids)).toEqual([{ id: 'name', desc: false }]);
    expect(parseSort('-lastSignIn', ids)).toEqual([{ id: 'lastSignIn', desc: true }]);
    expect(parseSort('-password', ids)).toEqual([]);
    expect(parseSort(null, ids)).toEqual([]);
  });
  it('writes what it reads', () => {
    expect(formatSort([{ id: 'lastSignIn', desc: true }])).toBe('-lastSignIn');
    expect(formatSort([])).toBeNull();
    expect(parseSort(formatSort([{ id: 'name', desc: false }]), ids)).toEqual([{ id: 'name', desc: false }]);
  });
  it('sets and removes one parameter without touching the others', () => {
    const params = new URLSearchParams('q=ma&sort=name');
    expect(withParam(params, 'sort', '-name').toString()).toBe('q=ma&sort=-name');
    expect(withParam(params, 'q', '').toString()).toBe('sort=name');
    expect(params.toString()).toBe('q=ma&sort=name');
  });
});

describe('compactChange', () => {
  it('lists changed, added and removed fields only', () => {
    const lines = compactChange(
      { title: 'Old', capacity: 24, room: 'B2', weekday: 'Tue' },
      { title: 'New', capacity: 24, weekday: 'Tue', assistants: [4, 5] },
    );
    expect(lines).toEqual([
      { key: 'title', kind: 'changed', before: '"Old"', after: '"New"' },
      { key: 'room', kind: 'removed', before: '"B2"' },
      { key: 'assistants', kind: 'added', after: '[4,5]' },
    ]);
  });
  it('treats a created record as all added and a deleted one as all removed', () => {
    expect(compactChange(null, { a: 1, b: true }).map((l) => `${l.kind}:${l.key}`)).toEqual(['added:a', 'added:b']);
    expect(compactChange({ a: 1 }, null)).toEqual([{ key: 'a', kind: 'removed', before: '1' }]);
    expect(compactChange(null, null)).toEqual([]);
  });
  it('compares nested values by content and handles non-object records', () => {
    expect(compactChange({ a: { x: [1, 2] } }, { a: { x: [1, 2] } })).toEqual([]);
    expect(compactChange('draft', 'published')).toEqual([
      { key: '', kind: 'changed', before: '"draft"', after: '"published"' },
    ]);
  });
  it('cuts long values with an ellipsis', () => {
    const text = shortJson('x'.repeat(100), 20);
    expect(text).toHaveLength(20);
    expect(text.endsWith('…')).toBe(true);
  });
});

describe('format', () => {
  it('leaves calendar dates unshifted and groups counts with thin spaces', () => {
    expect(formatDate('2026-09-07')).toBe('2026-09-07');
    expect(formatCount(1204)).toBe('1\u2009204');
    expect(formatCount(38)).toBe('38');
  });
});
