import { Router } from 'express';
import type { Knex } from 'knex';
import { actorOf } from '../audit/actor';
import { siteEngineering } from '../engineering/site-engineering';
import { parseRequest } from '../http/validate';
import { requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { sitingCheckInputSchema, systemTestInputSchema, walkTestInputSchema } from './schema';
import {
  commissioningOverview,
  preIssueCheck,
  recordSitingCheck,
  recordSystemTest,
  recordWalkTest,
} from './service';

/** JSON has no infinity: open-ended bands and open readings travel as null. */
function withoutInfinity<T>(value: T): T {
  return JSON.parse(
    JSON.stringify(value, (_key, item) => (item === Number.POSITIVE_INFINITY ? null : item)),
  ) as T;
}

export function createCommissioningRouter({ db }: { db: Knex }): Router {
  const router = Router();
  const installerStaff = requireSiteRelation(db, ...STAFF_WRITERS);

  router.get(
    '/api/sites/:siteId/engineering',
    installerStaff,
    async function engineering(req, res) {
      res.json(withoutInfinity({ engineering: await siteEngineering(db, siteAccessOf(req).id) }));
    },
  );

  router.get(
    '/api/sites/:siteId/commissioning',
    installerStaff,
    async function commissioning(req, res) {
      res.json(withoutInfinity(await commissioningOverview(db, siteAccessOf(req).id)));
    },
  );

  router.get('/api/sites/:siteId/pre-issue-check', installerStaff, async function check(req, res) {
    res.json(await preIssueCheck(db, siteAccessOf(req).id));
  });

  router.post('/api/sites/:siteId/walk-tests', installerStaff, async function walkTest(req, res) {
    const input = parseRequest(walkTestInputSchema, req.body, 'body');
    const { created, walkTest: recorded } = await recordWalkTest(
      db,
      siteAccessOf(req),
      input,
      actorOf(req),
    );
    res.status(created ? 201 : 200).json(recorded);
  });

  router.post(
    '/api/sites/:siteId/siting-checks',
    installerStaff,
    async function sitingCheck(req, res) {
      const input = parseRequest(sitingCheckInputSchema, req.body, 'body');
      const result = await recordSitingCheck(db, siteAccessOf(req), input, actorOf(req));
      res.status(result.created ? 201 : 200).json(result);
    },
  );

  router.post(
    '/api/sites/:siteId/system-tests',
    installerStaff,
    async function systemTest(req, res) {
      const input = parseRequest(systemTestInputSchema, req.body, 'body');
      const result = await recordSystemTest(db, siteAccessOf(req), input, actorOf(req));
      res.status(result.created ? 201 : 200).json(result);
    },
  );

  return router;
}
