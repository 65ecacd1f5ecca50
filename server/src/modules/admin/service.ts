import type { Knex } from 'knex';
import type { AdminUserRow, AuditEntry } from '@shared/api/admin';
import { listAudit, listUsers } from './repo';

const iso = (d: Date | string | null) => (d == null ? null : new Date(d).toISOString());
const parseJson = (v: unknown) => (v == null ? null : typeof v === 'string' ? JSON.parse(v) : v);

export async function usersForAdmin(db: Knex): Promise<AdminUserRow[]> {
  const rows = await listUsers(db);
  return rows.map((r) => ({
    id: r.id,
    email: r.email,
    displayName: r.display_name,
    isAdmin: Boolean(Number(r.is_admin)),
    active: Boolean(r.active),
    lastSignInAt: iso(r.last_sign_in_at),
    createdAt: iso(r.created_at)!,
  }));
}

export async function auditPage(db: Knex, limit: number, before?: number): Promise<{ entries: AuditEntry[]; nextBefore: number | null }> {
  const rows = await listAudit(db, limit + 1, before);
  const page = rows.slice(0, limit);
  return {
    entries: page.map((r) => ({
      id: Number(r.id),
      at: iso(r.at)!,
      actorId: r.actor_id,
      actorName: r.actor_name,
      action: r.action,
      entityType: r.entity_type,
      entityId: r.entity_id,
      before: parseJson(r.before_json),
      after: parseJson(r.after_json),
    })),
    nextBefore: rows.length > limit ? Number(page[page.length - 1].id) : null,
  };
}
