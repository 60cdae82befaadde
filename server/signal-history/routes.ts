import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { currentUser } from '../auth/current-user';
import { NotFoundError } from '../http/errors';
import { requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { requireSiteRelation } from '../sites/access';
import { falseAlarmRecord, signalHistory } from './service';

const homeParams = z.object({ siteId: z.uuid() });
const historyQuery = z.object({
  before: z
    .string()
    .regex(/^[1-9][0-9]{0,17}$/, 'before must be a signal id from the previous page')
    .optional(),
});

/** What a site's panel has reported: its owner's history, and the installer's false alarms. */
export function createSignalHistoryRouter({ db }: { db: Knex }): Router {
  const router = Router();

  router.get(
    '/api/my/homes/:siteId/signals',
    requireRole('homeowner'),
    async function homeSignals(req, res) {
      const { siteId } = parseRequest(homeParams, req.params, 'params');
      const { before } = parseRequest(historyQuery, req.query, 'query');
      const owned = await db('site_homeowners')
        .where({ site_id: siteId, user_id: currentUser(req).id })
        .first('site_id');
      if (!owned) throw new NotFoundError();
      res.json(await signalHistory(db, siteId, before ?? null));
    },
  );

  router.get(
    '/api/sites/:siteId/false-alarms',
    requireSiteRelation(db, 'engineer', 'office', 'operator'),
    async function falseAlarms(req, res) {
      res.json(await falseAlarmRecord(db, String(req.params.siteId)));
    },
  );

  return router;
}
