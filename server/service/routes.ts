import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { actorOf } from '../audit/actor';
import { currentUser } from '../auth/current-user';
import { SERVICE_PLAN_RULE, SERVICE_PLAN_SOURCE } from '../calc/service-plan';
import type { FileStorage } from '../files/storage';
import type { PackBuildQueue } from '../handover/build-queue';
import { organisationIdsFor, requireRole } from '../http/guards';
import { refuseUserCodes } from '../http/refuse-user-codes';
import { parseRequest } from '../http/validate';
import type { Mailer } from '../mail/mailer';
import { requestServiceReport } from '../service-report/service';
import { requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { completeVisit } from './completion';
import {
  bookCalloutInputSchema,
  completeVisitInputSchema,
  scheduleQuerySchema,
  scheduleVisitInputSchema,
  updateVisitInputSchema,
  visitParamsSchema,
} from './schema';
import {
  bookCallout,
  overdueSites,
  schedule,
  scheduleVisit,
  servicePlanForSite,
  ukDateOf,
  updateVisit,
} from './service';

/**
 * Service and maintenance: each site's plan (from its signalling), the office's schedule of
 * visits, booking and moving them, call-outs, the engineer completing a visit, and the sites
 * whose preventive visit is overdue. Homeowners' fault reports are in server/faults, their
 * service history in server/service-history, a completed visit's report in server/service-report.
 *
 * Still to come (issue 7): reminders.
 */
export function createServiceRouter(deps: {
  db: Knex;
  storage: FileStorage;
  mailer: Mailer;
  logger: Logger;
  serviceReportQueue?: PackBuildQueue;
}): Router {
  const { db } = deps;
  const reportDeps = { ...deps, reportQueue: deps.serviceReportQueue };
  const router = Router();
  const installersOf = (req: Request) =>
    organisationIdsFor(currentUser(req), ['engineer', 'office']);
  const officesOf = (req: Request) => organisationIdsFor(currentUser(req), ['office']);
  const engineersOf = (req: Request) => organisationIdsFor(currentUser(req), ['engineer']);
  const today = () => ukDateOf(new Date());

  // --- One site ------------------------------------------------------------------------------
  router.get(
    '/api/sites/:siteId/service-plan',
    requireSiteRelation(db, 'engineer', 'office', 'homeowner'),
    async function plan(req, res) {
      res.json(await servicePlanForSite(db, siteAccessOf(req).id, today()));
    },
  );

  router.post(
    '/api/sites/:siteId/service/visits',
    requireSiteRelation(db, 'office'),
    async function book(req, res) {
      const input = parseRequest(scheduleVisitInputSchema, req.body, 'body');
      const { created, visit } = await scheduleVisit(
        db,
        siteAccessOf(req),
        input,
        actorOf(req),
        new Date(),
      );
      res.status(created ? 201 : 200).json(visit);
    },
  );

  // A corrective visit, from a homeowner's fault report or a phone call.
  router.post(
    '/api/sites/:siteId/service/callouts',
    requireSiteRelation(db, ...STAFF_WRITERS),
    async function bookCalloutVisit(req, res) {
      const input = parseRequest(bookCalloutInputSchema, req.body, 'body');
      const { created, visit } = await bookCallout(
        db,
        siteAccessOf(req),
        input,
        actorOf(req),
        new Date(),
      );
      res.status(created ? 201 : 200).json(visit);
    },
  );

  // --- The company's schedule ------------------------------------------------------------------
  router.get(
    '/api/service/visits',
    requireRole('engineer', 'office'),
    async function visits(req, res) {
      const query = parseRequest(scheduleQuerySchema, req.query, 'query');
      res.json(await schedule(db, installersOf(req), query, today()));
    },
  );

  router.patch(
    '/api/service/visits/:visitId',
    requireRole('office'),
    async function move(req, res) {
      const { visitId } = parseRequest(visitParamsSchema, req.params, 'params');
      const input = parseRequest(updateVisitInputSchema, req.body, 'body');
      res.json(await updateVisit(db, officesOf(req), visitId, input, actorOf(req), new Date()));
    },
  );

  // The engineer's form from site, often sent from a phone on a poor signal: a resend with the
  // same key answers with the visit it completed.
  router.post(
    '/api/service/visits/:visitId/complete',
    requireRole('engineer'),
    refuseUserCodes,
    async function complete(req, res) {
      const { visitId } = parseRequest(visitParamsSchema, req.params, 'params');
      const input = parseRequest(completeVisitInputSchema, req.body, 'body');
      const visit = await completeVisit(
        db,
        engineersOf(req),
        visitId,
        input,
        actorOf(req),
        new Date(),
      );
      // The report is drawn and e-mailed by a job: the engineer's phone is answered at once.
      await requestServiceReport(reportDeps, visitId);
      res.json(visit);
    },
  );

  router.get('/api/service/overdue', requireRole('office'), async function overdue(req, res) {
    const day = today();
    res.json({
      today: day,
      rule: SERVICE_PLAN_RULE,
      source: SERVICE_PLAN_SOURCE,
      sites: await overdueSites(db, officesOf(req), day),
    });
  });

  return router;
}
