import express, { type Express } from 'express';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { requestLogger } from '../../http/logger';
import { apiNotFound, problemHandler } from '../../http/problem-handler';
import { createIntakeRouter } from './routes';

export interface IntakeDeps {
  db: Knex;
  logger: Logger;
}

/**
 * The HTTPS intake for IP communicators: JSON signals with a bearer token per site, in the
 * receiver process beside DC-09. Built here, listened on by server.ts, so tests call it in
 * process. No sessions, cookies or CSRF: nothing here is for browsers.
 */
export function createIntakeApp(deps: IntakeDeps): Express {
  const app = express();
  app.disable('x-powered-by');
  app.use(requestLogger(deps.logger));
  app.use((_req, res, next) => {
    res.set('Cache-Control', 'no-store');
    next();
  });
  app.use(createIntakeRouter(deps));
  app.use(apiNotFound);
  app.use(problemHandler(deps.logger));
  return app;
}
