import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { currentUser } from '../auth/current-user';
import { ForbiddenError } from '../http/errors';
import { hasRole, requireSignedIn } from '../http/guards';
import { parseRequest } from '../http/validate';
import { roleSchema } from '../users/roles';
import { roleHome } from './service';

const params = z.object({ role: roleSchema });

export function createHomesRouter({ db }: { db: Knex }): Router {
  const router = Router();

  router.get('/api/homes/:role', requireSignedIn, async function home(req, res) {
    const { role } = parseRequest(params, req.params, 'params');
    const user = currentUser(req);
    if (!hasRole(user, [role]))
      throw new ForbiddenError(`This account does not hold the ${role} role.`);
    res.json(await roleHome(db, user, role));
  });

  return router;
}
