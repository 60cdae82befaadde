import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { actorOf } from '../audit/actor';
import { parseRequest } from '../http/validate';
import { requireSiteRelation, siteAccessOf, STAFF_WRITERS } from '../sites/access';
import { listUserSlots } from './repository';
import { createUserSlotSchema, updateUserSlotSchema } from './schema';
import { addUserSlot, removeUserSlot, updateUserSlot } from './service';

const slotParams = z.object({ slotId: z.uuid() });
// Operators and keyholders have no business with who holds which code slot.
const SLOT_KEEPERS = ['engineer', 'office', 'homeowner'] as const;

export function createUserSlotsRouter({ db }: { db: Knex }): Router {
  const router = Router();
  const slotId = (params: unknown) => parseRequest(slotParams, params, 'params').slotId;

  router.get(
    '/api/sites/:siteId/user-slots',
    requireSiteRelation(db, ...SLOT_KEEPERS),
    async function slots(req, res) {
      res.json({ slots: await listUserSlots(db, siteAccessOf(req).id) });
    },
  );

  router.post(
    '/api/sites/:siteId/user-slots',
    requireSiteRelation(db, ...SLOT_KEEPERS),
    async function slotAdd(req, res) {
      const input = parseRequest(createUserSlotSchema, req.body, 'body');
      res.status(201).json(await addUserSlot(db, siteAccessOf(req), input, actorOf(req)));
    },
  );

  router.patch(
    '/api/sites/:siteId/user-slots/:slotId',
    requireSiteRelation(db, ...SLOT_KEEPERS),
    async function slotUpdate(req, res) {
      const id = slotId(req.params);
      const input = parseRequest(updateUserSlotSchema, req.body, 'body');
      res.json(await updateUserSlot(db, siteAccessOf(req), id, input, actorOf(req)));
    },
  );

  router.delete(
    '/api/sites/:siteId/user-slots/:slotId',
    requireSiteRelation(db, ...STAFF_WRITERS),
    async function slotRemove(req, res) {
      await removeUserSlot(db, siteAccessOf(req), slotId(req.params), actorOf(req));
      res.status(204).end();
    },
  );

  return router;
}
