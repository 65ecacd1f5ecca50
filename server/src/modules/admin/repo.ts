import type { Knex } from 'knex';

export function listUsers(db: Knex) {
  return db('users as u')
    .leftJoin('user_site_roles as r', function () {
      this.on('r.user_id', 'u.id').andOn('r.role', db.raw('?', ['admin']));
    })
    .select('u.id', 'u.email', 'u.display_name', 'u.active', 'u.last_sign_in_at', 'u.created_at', db.raw('r.user_id IS NOT NULL as is_admin'))
    .orderBy('u.display_name');
}

export function listAudit(db: Knex, limit: number, before?: number) {
  const q = db('audit_log as a')
    .leftJoin('users as u', 'u.id', 'a.actor_id')
    .select('a.id', 'a.at', 'a.actor_id', 'u.display_name as actor_name', 'a.action', 'a.entity_type', 'a.entity_id', 'a.before_json', 'a.after_json')
    .orderBy('a.id', 'desc')
    .limit(limit);
  if (before) q.where('a.id', '<', before);
  return q;
}
