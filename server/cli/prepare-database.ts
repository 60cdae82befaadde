import path from 'node:path';
import type { Config } from '../config/config';
import { createDb } from '../db/knex';
import { createLocalDiskStorage } from '../files/storage';
import { migrateToLatest, runSeeds } from '../db/migrate';
import { ensureDatabase, startPostgres, type RunningPostgres } from '../db/postgres-server';

/** Starts (or reuses) the project's PostgreSQL and makes sure the configured database exists. */
export async function openLocalDatabase(
  config: Config,
  log: (message: string) => void,
): Promise<RunningPostgres> {
  const postgres = await startPostgres({
    dataDir: path.join(config.dataDir, 'postgres'),
    port: config.postgres.port,
    log,
  });
  await ensureDatabase(postgres, config.postgres.database);
  return postgres;
}

/** As openLocalDatabase, then migrates and (optionally) seeds the demo. */
export async function prepareDatabase(
  config: Config,
  options: { seed: boolean; log: (message: string) => void },
): Promise<RunningPostgres> {
  const postgres = await openLocalDatabase(config, options.log);
  const db = createDb(config.postgres, 2);
  try {
    const applied = await migrateToLatest(db);
    if (applied.length) options.log(`applied ${applied.length} migration(s)`);
    if (options.seed)
      await runSeeds(db, { storage: createLocalDiskStorage(path.join(config.dataDir, 'files')) });
  } finally {
    await db.destroy();
  }
  return postgres;
}
