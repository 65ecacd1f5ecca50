/**
 * Sign-in bookkeeping: the first sign-in creates the user, later ones refresh
 * e-mail and name from the identity provider; admins named by ADMIN_EMAILS get
 * the admin site role. Everything in one transaction, audited.
 */
import type { Knex } from 'knex';
import type { CurrentUser } from '@shared/api/session';
import { recordAudit } from '../../platform/audit';
import { courseRolesOf, findUserById, findUserBySubject, siteRolesOf, type UserRow } from './repo';

export interface SignInClaims {
  issuer: string;
  subject: string;
  email: string;
  /** the provider vouches for the e-mail address (OIDC `email_verified`) */
  emailVerified: boolean;
  displayName: string;
}

export class InactiveAccountError extends Error {}

export async function recordSignIn(db: Knex, claims: SignInClaims, adminEmails: Set<string>): Promise<UserRow> {
  return db.transaction(async (trx) => {
    let user = await findUserBySubject(trx, claims.issuer, claims.subject);
    const now = new Date();
    // A person known from a course roster who signs in for the first time: the roster
    // made a users row without an identity; attach this identity to it (matched by e-mail),
    // but only when the provider has verified that address — otherwise anyone able to
    // claim a student's address at the provider could take over their roster entry.
    const fromRoster = user || !claims.emailVerified
      ? undefined
      : await trx<UserRow>('users').whereNull('oidc_subject').andWhere('email', claims.email).orderBy('id').forUpdate().first();
    if (fromRoster) {
      if (!fromRoster.active) throw new InactiveAccountError('This account has been deactivated.');
      await trx('users').where({ id: fromRoster.id }).update({ oidc_issuer: claims.issuer, oidc_subject: claims.subject, email: claims.email, display_name: claims.displayName, last_sign_in_at: now, updated_at: now });
      await recordAudit(trx, { actorId: fromRoster.id, action: 'user.linked_on_first_sign_in', entityType: 'user', entityId: fromRoster.id, before: { displayName: fromRoster.display_name }, after: { displayName: claims.displayName } });
      user = (await trx<UserRow>('users').where({ id: fromRoster.id }).first())!;
    } else if (!user) {
      const [id] = await trx('users').insert({
        oidc_issuer: claims.issuer,
        oidc_subject: claims.subject,
        email: claims.email,
        display_name: claims.displayName,
        last_sign_in_at: now,
      });
      await recordAudit(trx, { actorId: id, action: 'user.created_on_first_sign_in', entityType: 'user', entityId: id, after: { displayName: claims.displayName } });
      user = (await trx<UserRow>('users').where({ id }).first())!;
    } else {
      if (!user.active) throw new InactiveAccountError('This account has been deactivated.');
      await trx('users').where({ id: user.id }).update({ email: claims.email, display_name: claims.displayName, last_sign_in_at: now, updated_at: now });
    }
    if (claims.emailVerified && adminEmails.has(claims.email.toLowerCase())) {
      const inserted = await trx.raw('INSERT IGNORE INTO user_site_roles (user_id, role) VALUES (?, ?)', [user.id, 'admin']);
      if (inserted[0]?.affectedRows) {
        await recordAudit(trx, { actorId: user.id, action: 'site_role.granted_by_configuration', entityType: 'user', entityId: user.id, after: { role: 'admin' } });
      }
    }
    await recordAudit(trx, { actorId: user.id, action: 'session.signed_in', entityType: 'user', entityId: user.id });
    return user;
  });
}

/** The signed-in person as the client sees them. */
export async function currentUser(db: Knex, userId: number): Promise<CurrentUser | null> {
  const user = await findUserById(db, userId);
  if (!user || !user.active) return null;
  const [siteRoles, courseRoles] = await Promise.all([siteRolesOf(db, userId), courseRolesOf(db, userId)]);
  const isAdmin = siteRoles.includes('admin');
  const roles = new Set<CurrentUser['roles'][number]>();
  if (isAdmin) roles.add('admin');
  for (const c of courseRoles) roles.add(c.role);
  const order = ['admin', 'lecturer', 'assistant', 'student'] as const;
  return {
    id: user.id,
    email: user.email,
    displayName: user.display_name,
    isAdmin,
    courses: courseRoles.map((c) => ({ courseId: c.course_id, code: c.code, title: c.title, role: c.role })),
    roles: order.filter((r) => roles.has(r)),
  };
}
