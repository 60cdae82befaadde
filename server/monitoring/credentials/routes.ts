import { Router, type Request } from 'express';
import type { Knex } from 'knex';
import { actorOf } from '../../audit/actor';
import { currentUser } from '../../auth/current-user';
import { organisationIdsFor, requireRole } from '../../http/guards';
import { parseRequest } from '../../http/validate';
import { signallingCredentialsInputSchema } from './schema';
import { issueIntakeToken, requireCentreSite, setSignallingCredentials } from './service';

/**
 * Operators set how a site's panel signs in to the receiver: its DC-09 key and its HTTPS
 * intake token. Only the operators of the centre monitoring the site; anyone else gets a 404.
 */
export function createSignallingCredentialsRouter({ db }: { db: Knex }): Router {
  const router = Router();
  const operators = requireRole('operator');
  const centresOf = (req: Request) => organisationIdsFor(currentUser(req), ['operator']);

  router.put(
    '/api/monitoring/sites/:siteId/signalling-credentials',
    operators,
    async function setCredentials(req, res) {
      const site = await requireCentreSite(db, centresOf(req), String(req.params.siteId));
      const input = parseRequest(signallingCredentialsInputSchema, req.body, 'body');
      res.json(await setSignallingCredentials(db, site, input, actorOf(req)));
    },
  );

  router.post(
    '/api/monitoring/sites/:siteId/intake-token',
    operators,
    async function issueToken(req, res) {
      const site = await requireCentreSite(db, centresOf(req), String(req.params.siteId));
      const issued = await issueIntakeToken(db, site, actorOf(req));
      // Shown once: no cache along the way may keep a copy.
      res.set('Cache-Control', 'no-store').status(201).json(issued);
    },
  );

  return router;
}
