import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import { requireUser } from '../../platform/access';
import { unauthenticated } from '../../platform/errors';
import { currentUser } from './service';

export function sessionRoutes(db: Knex, generateCsrfToken: (req: Request) => string): Router {
  const r = Router();
  r.get('/me', requireUser, async (req, res) => {
    const me = await currentUser(db, req.user!.id);
    if (!me) throw unauthenticated();
    res.json(me);
  });
  // The token lives in the session; anonymous callers get one too (for the sign-out of a stale tab).
  r.get('/csrf-token', (req, res) => {
    res.json({ token: generateCsrfToken(req) });
  });
  return r;
}
