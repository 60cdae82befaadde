import path from 'node:path';
import type { Config } from '../config/config';
import { createDb } from '../db/knex';
import { migrateToLatest, runSeeds } from '../db/migrate';
import { ensureDatabase, startPostgres, type RunningPostgres } from '../db/postgres-server';

/** Starts PostgreSQL, creates the database, migrates and (optionally) seeds the demo. */
export async function prepareDatabase(
  config: Config,
  options: { seed: boolean; log: (message: string) => void },
): Promise<RunningPostgres> {
  const postgres = await startPostgres({
    dataDir: path.join(config.dataDir, 'postgres'),
    port: config.postgres.port,
    log: options.log,
  });
  await ensureDatabase(postgres, config.postgres.database);
  const db = createDb(config.postgres, 2);
  try {
    const applied = await migrateToLatest(db);
    if (applied.length) options.log(`applied ${applied.length} migration(s)`);
    if (options.seed) await runSeeds(db);
  } finally {
    await db.destroy();
  }
  return postgres;
}
