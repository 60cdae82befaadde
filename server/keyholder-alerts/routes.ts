import { Router } from 'express';
import type { Knex } from 'knex';
import { currentUser } from '../auth/current-user';
import { requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { alertParamsSchema, alertResponseInputSchema } from './schema';
import { keyholderAlerts, respondToAlert } from './service';

/** A keyholder's alarms: the one they are being asked to attend now, and past ones. */
export function createKeyholderAlertsRouter({
  db,
  callOut,
}: {
  db: Knex;
  callOut?: { kick(): void };
}): Router {
  const router = Router();
  const keyholders = requireRole('keyholder');

  router.get('/api/my/alerts', keyholders, async function myAlerts(req, res) {
    res.json(await keyholderAlerts(db, currentUser(req).id));
  });

  router.post('/api/my/alerts/:eventId/response', keyholders, async function respond(req, res) {
    const { eventId } = parseRequest(alertParamsSchema, req.params, 'params');
    const { response } = parseRequest(alertResponseInputSchema, req.body, 'body');
    const { alert, moveOn } = await respondToAlert(db, currentUser(req).id, eventId, response);
    if (moveOn) callOut?.kick();
    res.json(alert);
  });

  return router;
}
