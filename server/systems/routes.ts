import { Router } from 'express';
import type { Knex } from 'knex';
import { actorOf } from '../audit/actor';
import { parseRequest } from '../http/validate';
import { RECORD_READERS, requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { getSystemRecord } from './repository';
import { saveSystemSchema } from './schema';
import { saveSystem } from './service';

export function createSystemsRouter({ db }: { db: Knex }): Router {
  const router = Router();

  router.get(
    '/api/sites/:siteId/system',
    requireSiteRelation(db, ...RECORD_READERS),
    async function system(req, res) {
      res.json({ system: await getSystemRecord(db, siteAccessOf(req).id) });
    },
  );

  router.put(
    '/api/sites/:siteId/system',
    requireSiteRelation(db, ...STAFF_WRITERS),
    async function systemSave(req, res) {
      const input = parseRequest(saveSystemSchema, req.body, 'body');
      res.json({ system: await saveSystem(db, siteAccessOf(req), input, actorOf(req)) });
    },
  );

  return router;
}
