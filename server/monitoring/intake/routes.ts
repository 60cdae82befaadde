import express, { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { parseRequest } from '../../http/validate';
import { intakeSignalSchema } from './schema';
import { receiveIntakeSignal, siteForIntakeToken } from './service';

/** The token is checked before the body is read: a caller without one learns nothing more. */
function requireIntakeToken(db: Knex): RequestHandler {
  return async function intakeToken(req, res, next) {
    try {
      const { site, tokenHash } = await siteForIntakeToken(db, req.get('authorization'));
      res.locals.intakeSiteId = site.id;
      res.locals.intakeTokenHash = tokenHash;
      next();
    } catch (error) {
      res.set('WWW-Authenticate', 'Bearer realm="wardbook-intake"');
      next(error);
    }
  };
}

export function createIntakeRouter({ db }: { db: Knex }): Router {
  const router = Router();

  // One signal per request; a few kilobytes is generous.
  router.post(
    '/v1/signals',
    requireIntakeToken(db),
    express.json({ limit: '8kb' }),
    async function receiveSignal(req, res) {
      const input = parseRequest(intakeSignalSchema, req.body, 'body');
      const receipt = await receiveIntakeSignal(
        db,
        String(res.locals.intakeTokenHash),
        input,
        JSON.stringify(req.body),
      );
      // 201 for a resend too: a communicator that lost the first reply sees the same success,
      // and `duplicate` says the signal was stored before.
      res.status(201).json(receipt);
    },
  );

  return router;
}
