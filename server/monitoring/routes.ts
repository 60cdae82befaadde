import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { actorOf } from '../audit/actor';
import { currentUser } from '../auth/current-user';
import { organisationIdsFor, requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { closeEventInputSchema, eventListQuerySchema } from './schema';
import { createLiveFeed } from './live';
import {
  closeEvent,
  eventDetail,
  eventVisibleTo,
  findEvent,
  handlingFigures,
  listEvents,
  takeEvent,
} from './service';
import {
  recordCallInputSchema,
  requestPoliceInputSchema,
  startCallOutInputSchema,
} from './callout/schema';
import { recordCall, requestPolice, startCallOut } from './callout/service';

/** The monitoring centre's side: the queue of alarm events and what operators do with them. */
export function createMonitoringRouter({
  db,
  logger,
  callOut,
}: {
  db: Knex;
  logger: Logger;
  /** Sends queued keyholder texts; without it they wait for the next process that has one. */
  callOut?: { kick(): void };
}): Router {
  const router = Router();
  const feed = createLiveFeed(db, logger);
  const operators = requireRole('operator');
  const centresOf = (req: Request) => organisationIdsFor(currentUser(req), ['operator']);

  router.get('/api/monitoring/events', operators, async function queue(req, res) {
    const { status } = parseRequest(eventListQuerySchema, req.query, 'query');
    res.json({ events: await listEvents(db, centresOf(req), status) });
  });

  // Server-sent events: a line per change to the queue, so screens refetch within a second.
  router.get('/api/monitoring/stream', operators, function stream(req, res) {
    const centres = centresOf(req);
    res.set({
      'Content-Type': 'text/event-stream; charset=utf-8',
      'Cache-Control': 'no-cache, no-transform',
      Connection: 'keep-alive',
      'X-Accel-Buffering': 'no',
    });
    res.flushHeaders();
    res.write('retry: 2000\n\nevent: ready\ndata: {}\n\n');
    const unsubscribe = feed.subscribe((change) => {
      void (async () => {
        if (change.eventId && !(await eventVisibleTo(db, centres, change.eventId))) return;
        res.write(`event: change\ndata: ${JSON.stringify(change)}\n\n`);
      })().catch(() => undefined);
    });
    // A comment now and then keeps proxies from closing a quiet stream.
    const heartbeat = setInterval(() => res.write(': still here\n\n'), 25_000);
    req.on('close', () => {
      clearInterval(heartbeat);
      unsubscribe();
    });
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

  router.post(
    '/api/monitoring/events/:eventId/call-out',
    operators,
    async function messageKeyholders(req, res) {
      const eventId = String(req.params.eventId);
      parseRequest(startCallOutInputSchema, req.body ?? {}, 'body');
      await findEvent(db, centresOf(req), eventId);
      await startCallOut(db, eventId, currentUser(req), actorOf(req));
      callOut?.kick();
      res.json(await eventDetail(db, centresOf(req), eventId));
    },
  );

  router.post('/api/monitoring/events/:eventId/calls', operators, async function call(req, res) {
    const eventId = String(req.params.eventId);
    const input = parseRequest(recordCallInputSchema, req.body, 'body');
    await findEvent(db, centresOf(req), eventId);
    await recordCall(db, eventId, input, currentUser(req), actorOf(req));
    res.json(await eventDetail(db, centresOf(req), eventId));
  });

  router.post('/api/monitoring/events/:eventId/police', operators, async function police(req, res) {
    const eventId = String(req.params.eventId);
    const input = parseRequest(requestPoliceInputSchema, req.body, 'body');
    await findEvent(db, centresOf(req), eventId);
    await requestPolice(db, eventId, input, currentUser(req), actorOf(req));
    res.json(await eventDetail(db, centresOf(req), eventId));
  });

  router.get('/api/monitoring/figures', operators, async function figures(req, res) {
    res.json(await handlingFigures(db, centresOf(req)));
  });

  return router;
}
