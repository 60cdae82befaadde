import { Router } from 'express';
import type { Knex } from 'knex';
import { currentUser } from '../auth/current-user';
import type { FileStorage } from '../files/storage';
import { requireRole } from '../http/guards';
import { parseRequest } from '../http/validate';
import { visitParamsSchema } from '../service/schema';
import { openServiceReport } from './service';

/** A completed visit's report PDF, drawn by the service-report job (service.ts). */
export function createServiceReportRouter(deps: { db: Knex; storage: FileStorage }): Router {
  const router = Router();

  router.get(
    '/api/service/visits/:visitId/report.pdf',
    requireRole('engineer', 'office', 'homeowner'),
    async function downloadServiceReport(req, res) {
      const { visitId } = parseRequest(visitParamsSchema, req.params, 'params');
      const report = await openServiceReport(deps, currentUser(req), visitId);
      res
        .type('application/pdf')
        .set('Content-Disposition', `attachment; filename="${report.filename}"`)
        .set('Content-Length', String(report.sizeBytes))
        .set('Cache-Control', 'private, no-store');
      report.stream.pipe(res);
    },
  );

  return router;
}
