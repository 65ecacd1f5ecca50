/**
 * The append-only audit log: who, when, what, before/after as JSON.
 * The table refuses UPDATE and DELETE (triggers in the migration).
 */
import type { Knex } from 'knex';

export interface AuditRecord {
  actorId: number | null;
  action: string;
  entityType: string;
  entityId?: string | number | null;
  before?: unknown;
  after?: unknown;
}

export async function recordAudit(db: Knex | Knex.Transaction, rec: AuditRecord): Promise<void> {
  await db('audit_log').insert({
    actor_id: rec.actorId,
    action: rec.action,
    entity_type: rec.entityType,
    entity_id: rec.entityId == null ? null : String(rec.entityId),
    before_json: rec.before === undefined ? null : JSON.stringify(rec.before),
    after_json: rec.after === undefined ? null : JSON.stringify(rec.after),
  });
}
