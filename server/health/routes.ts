import { Router } from 'express';
import type { Knex } from 'knex';

export function createHealthRouter({ db }: { db: Knex }): Router {
  const router = Router();

  // Load balancers poll this; it answers without a session and says whether the database is up.
  router.get('/api/health', async function health(_req, res) {
    const started = process.hrtime.bigint();
    try {
      await db.raw('select 1').timeout(2000, { cancel: true });
      const latencyMs = Number(process.hrtime.bigint() - started) / 1e6;
      res.json({
        status: 'ok',
        database: { status: 'up', latencyMs: Math.round(latencyMs * 10) / 10 },
      });
    } catch {
      res.status(503).json({ status: 'degraded', database: { status: 'down' } });
    }
  });

  return router;
}
