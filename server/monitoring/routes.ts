import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import { actorOf } from '../audit/actor';
import { currentUser } from '../auth/current-user';
import { organisationIdsFor, requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { closeEventInputSchema, eventListQuerySchema } from './schema';
import { closeEvent, eventDetail, listEvents, takeEvent } from './service';

/** The monitoring centre's side: the queue of alarm events and what operators do with them. */
export function createMonitoringRouter({ db }: { db: Knex }): Router {
  const router = Router();
  const operators = requireRole('operator');
  const centresOf = (req: Request) => organisationIdsFor(currentUser(req), ['operator']);

  router.get('/api/monitoring/events', operators, async function queue(req, res) {
    const { status } = parseRequest(eventListQuerySchema, req.query, 'query');
    res.json({ events: await listEvents(db, centresOf(req), status) });
  });

  router.get('/api/monitoring/events/:eventId', operators, async function detail(req, res) {
    res.json(await eventDetail(db, centresOf(req), String(req.params.eventId)));
  });

  router.post('/api/monitoring/events/:eventId/take', operators, async function take(req, res) {
    const eventId = String(req.params.eventId);
    await takeEvent(db, centresOf(req), eventId, currentUser(req), actorOf(req));
    res.json(await eventDetail(db, centresOf(req), eventId));
  });

  router.post('/api/monitoring/events/:eventId/close', operators, async function close(req, res) {
    const eventId = String(req.params.eventId);
    const input = parseRequest(closeEventInputSchema, req.body, 'body');
    await closeEvent(db, centresOf(req), eventId, input, currentUser(req), actorOf(req));
    res.json(await eventDetail(db, centresOf(req), eventId));
  });

  return router;
}
