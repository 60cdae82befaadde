import { Router } from 'express';
import type { Knex } from 'knex';
import { actorOf } from '../audit/actor';
import { parseRequest } from '../http/validate';
import { RECORD_READERS, requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { saveDevicesSchema } from './schema';
import { getDeviceList, saveDeviceList } from './service';

export function createDevicesRouter({ db }: { db: Knex }): Router {
  const router = Router();

  router.get(
    '/api/sites/:siteId/devices',
    requireSiteRelation(db, ...RECORD_READERS),
    async function devices(req, res) {
      res.json(await getDeviceList(db, siteAccessOf(req).id));
    },
  );

  router.put(
    '/api/sites/:siteId/devices',
    requireSiteRelation(db, ...STAFF_WRITERS),
    async function devicesSave(req, res) {
      const input = parseRequest(saveDevicesSchema, req.body, 'body');
      res.json(await saveDeviceList(db, siteAccessOf(req), input, actorOf(req)));
    },
  );

  return router;
}
