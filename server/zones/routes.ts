import { Router } from 'express';
import type { Knex } from 'knex';
import { actorOf } from '../audit/actor';
import { parseRequest } from '../http/validate';
import { RECORD_READERS, requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { saveZonesSchema } from './schema';
import { getZoneSchedule, saveZoneSchedule } from './service';

export function createZonesRouter({ db }: { db: Knex }): Router {
  const router = Router();

  router.get(
    '/api/sites/:siteId/zones',
    requireSiteRelation(db, ...RECORD_READERS),
    async function zones(req, res) {
      res.json(await getZoneSchedule(db, siteAccessOf(req).id));
    },
  );

  router.put(
    '/api/sites/:siteId/zones',
    requireSiteRelation(db, ...STAFF_WRITERS),
    async function zonesSave(req, res) {
      const input = parseRequest(saveZonesSchema, req.body, 'body');
      res.json(await saveZoneSchedule(db, siteAccessOf(req), input, actorOf(req)));
    },
  );

  return router;
}
