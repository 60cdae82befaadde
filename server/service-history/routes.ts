import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { currentUser } from '../auth/current-user';
import { NotFoundError } from '../http/errors';
import { requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { serviceHistory } from './service';

const homeParams = z.object({ siteId: z.uuid() });

/** The homeowner's service history of their own home. */
export function createServiceHistoryRouter({ db }: { db: Knex }): Router {
  const router = Router();

  router.get(
    '/api/my/homes/:siteId/service-history',
    requireRole('homeowner'),
    async function homeServiceHistory(req, res) {
      const { siteId } = parseRequest(homeParams, req.params, 'params');
      const owned = await db('site_homeowners')
        .where({ site_id: siteId, user_id: currentUser(req).id })
        .first('site_id');
      if (!owned) throw new NotFoundError();
      res.json(await serviceHistory(db, siteId));
    },
  );

  return router;
}
