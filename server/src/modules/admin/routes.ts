import { Router } from 'express';
import type { Knex } from 'knex';
import { requireAdmin } from '../../platform/access';
import { validate } from '../../platform/validate';
import { auditQuerySchema } from './schema';
import { auditPage, usersForAdmin } from './service';

export function adminRoutes(db: Knex): Router {
  const r = Router();
  r.use(requireAdmin);
  r.get('/users', async (_req, res) => {
    res.json({ users: await usersForAdmin(db) });
  });
  r.get('/audit', validate({ query: auditQuerySchema }), async (req, res) => {
    const q = req.query as unknown as { limit: number; before?: number };
    res.json(await auditPage(db, q.limit, q.before));
  });
  return r;
}
