import { Router } from 'express';
import { z } from 'zod';
import { actorOf } from '../audit/actor';
import { currentUser } from '../auth/current-user';
import { parseRequest } from '../http/validate';
import { invitePerson, type InvitationDeps } from '../invitations/service';
import { RECORD_READERS, requireSiteRelation, siteAccessOf } from '../sites/access';
import { requireSite } from '../sites/service';
import { listKeyholders } from './repository';
import { createKeyholderSchema, reorderKeyholdersSchema, updateKeyholderSchema } from './schema';
import {
  addKeyholder,
  confirmKeyholder,
  removeKeyholder,
  reorderKeyholders,
  requireKeyholderEmail,
  updateKeyholder,
} from './service';

const keyholderParams = z.object({ keyholderId: z.uuid() });
// The installer's staff and the homeowner keep the call plan; operators read it.
const PLAN_KEEPERS = ['engineer', 'office', 'homeowner'] as const;

export function createKeyholdersRouter(deps: InvitationDeps): Router {
  const { db } = deps;
  const router = Router();
  const keyholderId = (params: unknown) =>
    parseRequest(keyholderParams, params, 'params').keyholderId;

  router.get(
    '/api/sites/:siteId/keyholders',
    requireSiteRelation(db, ...RECORD_READERS),
    async function keyholders(req, res) {
      res.json({ keyholders: await listKeyholders(db, siteAccessOf(req).id) });
    },
  );

  router.post(
    '/api/sites/:siteId/keyholders',
    requireSiteRelation(db, ...PLAN_KEEPERS),
    async function keyholderAdd(req, res) {
      const input = parseRequest(createKeyholderSchema, req.body, 'body');
      res.status(201).json(await addKeyholder(db, siteAccessOf(req), input, actorOf(req)));
    },
  );

  // Registered before /:keyholderId so "order" is never read as an id.
  router.put(
    '/api/sites/:siteId/keyholders/order',
    requireSiteRelation(db, ...PLAN_KEEPERS),
    async function keyholderOrder(req, res) {
      const { keyholderIds } = parseRequest(reorderKeyholdersSchema, req.body, 'body');
      res.json({
        keyholders: await reorderKeyholders(db, siteAccessOf(req), keyholderIds, actorOf(req)),
      });
    },
  );

  router.patch(
    '/api/sites/:siteId/keyholders/:keyholderId',
    requireSiteRelation(db, ...PLAN_KEEPERS),
    async function keyholderUpdate(req, res) {
      const id = keyholderId(req.params);
      const input = parseRequest(updateKeyholderSchema, req.body, 'body');
      res.json(await updateKeyholder(db, siteAccessOf(req), id, input, actorOf(req)));
    },
  );

  router.delete(
    '/api/sites/:siteId/keyholders/:keyholderId',
    requireSiteRelation(db, ...PLAN_KEEPERS),
    async function keyholderRemove(req, res) {
      await removeKeyholder(db, siteAccessOf(req), keyholderId(req.params), actorOf(req));
      res.status(204).end();
    },
  );

  router.post(
    '/api/sites/:siteId/keyholders/:keyholderId/confirm',
    requireSiteRelation(db, ...PLAN_KEEPERS),
    async function keyholderConfirm(req, res) {
      res.json(
        await confirmKeyholder(db, siteAccessOf(req), keyholderId(req.params), actorOf(req)),
      );
    },
  );

  router.post(
    '/api/sites/:siteId/keyholders/:keyholderId/invitation',
    requireSiteRelation(db, 'office', 'homeowner'),
    async function keyholderInvite(req, res) {
      const access = siteAccessOf(req);
      const keyholder = await requireKeyholderEmail(db, access, keyholderId(req.params));
      const site = await requireSite(db, access.id);
      await invitePerson(deps, {
        email: keyholder.email,
        displayName: keyholder.name,
        role: 'keyholder',
        siteName: site.name,
        invitedBy: currentUser(req).displayName,
        organisationId: access.installerId,
        actor: actorOf(req),
        link: async (trx, userId) => {
          await trx('keyholders').where({ id: keyholder.id }).update({ user_id: userId });
        },
      });
      res.status(202).json({ invited: true });
    },
  );

  return router;
}
