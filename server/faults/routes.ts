import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import multer from 'multer';
import { z } from 'zod';
import { actorOf } from '../audit/actor';
import { currentUser } from '../auth/current-user';
import { MAX_FILE_BYTES } from '../files/schema';
import { AppError, NotFoundError, ValidationError } from '../http/errors';
import { organisationIdsFor, requireRole } from '../http/guards';
import { refuseUserCodes } from '../http/refuse-user-codes';
import { parseRequest } from '../http/validate';
import { faultQueueQuerySchema, faultReportInputSchema, MAX_FAULT_PHOTOS } from './schema';
import { faultQueue, reportFault, type FaultDeps } from './service';

const homeParams = z.object({ siteId: z.uuid() });

/** Up to MAX_FAULT_PHOTOS photos in the field "photos", held in memory so their bytes are read. */
function receivePhotos(): RequestHandler {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: {
      fileSize: MAX_FILE_BYTES,
      files: MAX_FAULT_PHOTOS,
      fields: 4,
      fieldSize: 8192,
      parts: MAX_FAULT_PHOTOS + 4,
    },
  }).array('photos', MAX_FAULT_PHOTOS);
  return (req, res, next) =>
    upload(req, res, (error: unknown) => {
      if (!error) return next();
      const code = (error as { code?: string }).code;
      if (code === 'LIMIT_FILE_SIZE')
        return next(
          new AppError(
            413,
            'too-large',
            'Photo too large',
            `Each photo can be at most ${MAX_FILE_BYTES / 1024 / 1024} MiB. Nothing was saved.`,
          ),
        );
      if (code?.startsWith('LIMIT_') || code === 'MISSING_FIELD_NAME')
        return next(
          new ValidationError([
            {
              path: 'body.photos',
              message: `Attach at most ${MAX_FAULT_PHOTOS} photos, in the field named "photos".`,
            },
          ]),
        );
      next(error);
    });
}

/**
 * Homeowners' fault reports: made from the homeowner's phone with photos, acknowledged by
 * e-mail, and queued for the office of the site's installer.
 */
export function createFaultsRouter(deps: FaultDeps): Router {
  const router = Router();
  const { db } = deps;

  /** The homeowner's own home, or a 404: another's is not even confirmed to exist. */
  const requireOwnHome: RequestHandler = async (req, _res, next) => {
    const { siteId } = parseRequest(homeParams, req.params, 'params');
    const home = await ownedHome(db, siteId, currentUser(req).id);
    next(home ? undefined : new NotFoundError());
  };

  router.post(
    '/api/my/homes/:siteId/faults',
    requireRole('homeowner'),
    requireOwnHome,
    receivePhotos(),
    refuseUserCodes,
    async function reportHomeFault(req, res) {
      const { siteId } = parseRequest(homeParams, req.params, 'params');
      const input = parseRequest(faultReportInputSchema, req.body ?? {}, 'body');
      const user = currentUser(req);
      const home = (await ownedHome(db, siteId, user.id))!;
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      const { created, report } = await reportFault(
        deps,
        { id: siteId, installerId: home.installer_id },
        user,
        input,
        files.map((file) => ({ originalName: file.originalname, bytes: file.buffer })),
        actorOf(req),
      );
      res.status(created ? 201 : 200).json(report);
    },
  );

  router.get('/api/service/faults', requireRole('office'), async function faults(req, res) {
    const query = parseRequest(faultQueueQuerySchema, req.query, 'query');
    res.json(await faultQueue(db, organisationIdsFor(currentUser(req), ['office']), query));
  });

  return router;
}

function ownedHome(db: Knex, siteId: string, userId: string) {
  return db('sites as s')
    .join('site_homeowners as h', 'h.site_id', 's.id')
    .where({ 's.id': siteId, 'h.user_id': userId })
    .first<{ installer_id: string } | undefined>('s.installer_id');
}
