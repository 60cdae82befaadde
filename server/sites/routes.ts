import { Router } from 'express';
import { z } from 'zod';
import { actorOf } from '../audit/actor';
import { recordAuditEntry } from '../audit/repository';
import { currentUser } from '../auth/current-user';
import { organisationIdsFor, requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { invitePerson, type InvitationDeps } from '../invitations/service';
import { requireSiteRelation, siteAccessOf, STAFF_WRITERS } from './access';
import { listSites } from './repository';
import {
  assignEngineersSchema,
  createSiteSchema,
  inviteHomeownerSchema,
  siteListQuerySchema,
  updateSiteSchema,
} from './schema';
import { assignEngineers, createSite, requireSite, updateSite } from './service';

const homeownerParams = z.object({ userId: z.uuid() });

export function createSitesRouter(deps: InvitationDeps): Router {
  const { db } = deps;
  const router = Router();

  // --- The installer's (or monitoring centre's) list of sites ---------------------------------
  router.get(
    '/api/sites',
    requireRole('engineer', 'office', 'operator'),
    async function siteList(req, res) {
      const filters = parseRequest(siteListQuerySchema, req.query, 'query');
      const user = currentUser(req);
      const { items, total } = await listSites(
        db,
        {
          installerIds: organisationIdsFor(user, ['engineer', 'office']),
          monitoringCentreIds: organisationIdsFor(user, ['operator']),
        },
        filters,
      );
      res.json({ items, page: filters.page, pageSize: filters.pageSize, total });
    },
  );

  router.post('/api/sites', requireRole('engineer', 'office'), async function siteCreate(req, res) {
    const input = parseRequest(createSiteSchema, req.body, 'body');
    res.status(201).json(await createSite(db, currentUser(req), input, actorOf(req)));
  });

  // --- One site -------------------------------------------------------------------------------
  router.get(
    '/api/sites/:siteId',
    requireSiteRelation(db, 'engineer', 'office', 'operator'),
    async function siteDetail(req, res) {
      res.json(await requireSite(db, siteAccessOf(req).id));
    },
  );

  router.patch(
    '/api/sites/:siteId',
    requireSiteRelation(db, ...STAFF_WRITERS),
    async function siteUpdate(req, res) {
      const input = parseRequest(updateSiteSchema, req.body, 'body');
      res.json(await updateSite(db, siteAccessOf(req), input, actorOf(req)));
    },
  );

  router.put(
    '/api/sites/:siteId/engineers',
    requireSiteRelation(db, 'office'),
    async function siteEngineers(req, res) {
      const { userIds } = parseRequest(assignEngineersSchema, req.body, 'body');
      res.json(await assignEngineers(db, siteAccessOf(req), userIds, actorOf(req)));
    },
  );

  // --- Homeowners: invited by the office -----------------------------------------------------
  router.post(
    '/api/sites/:siteId/homeowners',
    requireSiteRelation(db, 'office'),
    async function inviteHomeowner(req, res) {
      const { displayName, email } = parseRequest(inviteHomeownerSchema, req.body, 'body');
      const access = siteAccessOf(req);
      const site = await requireSite(db, access.id);
      await invitePerson(deps, {
        email,
        displayName,
        role: 'homeowner',
        siteName: site.name,
        invitedBy: `${currentUser(req).displayName} of ${site.installer.name}`,
        organisationId: access.installerId,
        actor: actorOf(req),
        link: async (trx, userId) => {
          await trx('site_homeowners')
            .insert({ site_id: access.id, user_id: userId })
            .onConflict()
            .ignore();
        },
      });
      res.status(201).json(await requireSite(db, access.id));
    },
  );

  router.delete(
    '/api/sites/:siteId/homeowners/:userId',
    requireSiteRelation(db, 'office'),
    async function removeHomeowner(req, res) {
      const { userId } = parseRequest(homeownerParams, req.params, 'params');
      const access = siteAccessOf(req);
      await db.transaction(async (trx) => {
        const removed = await trx('site_homeowners')
          .where({ site_id: access.id, user_id: userId })
          .delete();
        if (removed) {
          await recordAuditEntry(trx, {
            ...actorOf(req),
            action: 'site.homeowner_removed',
            entityType: 'site',
            entityId: access.id,
            organisationId: access.installerId,
            summary: 'Removed a homeowner from the site',
            changes: { homeowner: { from: userId, to: null } },
          });
        }
      });
      res.json(await requireSite(db, access.id));
    },
  );

  // --- Choices for the site form --------------------------------------------------------------
  router.get(
    '/api/monitoring-centres',
    requireRole('engineer', 'office'),
    async function monitoringCentres(_req, res) {
      const monitoringCentres = await db('organisations')
        .where({ kind: 'monitoring_centre' })
        .orderBy('name')
        .select('id', 'name');
      res.json({ monitoringCentres });
    },
  );

  return router;
}
