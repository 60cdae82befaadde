import { randomBytes } from 'node:crypto';
import { existsSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { loadConfig } from '../../server/config/config';
import { createDb, type DatabaseConnection } from '../../server/db/knex';
import { migrateToLatest, runSeeds } from '../../server/db/migrate';
import {
  dropDatabase,
  ensureDatabase,
  startPostgres,
  stopPostgresServer,
} from '../../server/db/postgres-server';

const PREFIX = 'wardbook_test_';

/**
 * Starts the project's PostgreSQL (or reuses a running one) and makes a throwaway database,
 * migrated and seeded with the demo scenario. The returned function drops it again, and
 * stops the server when tests started it and no other test database is left on it.
 */
export async function createTestDatabase(): Promise<{
  connection: DatabaseConnection;
  drop: () => Promise<void>;
}> {
  const config = loadConfig({ ...process.env, NODE_ENV: 'test' });
  const dataDir = path.join(config.dataDir, 'postgres');
  const postgres = await startPostgres({
    dataDir,
    port: config.postgres.port,
    anyFreePort: true,
  });
  const startedByTests = path.join(config.dataDir, 'postgres-started-by-tests');
  if (postgres.startedHere) writeFileSync(startedByTests, `${process.pid}\n`);

  const database = `${PREFIX}${Date.now()}_${randomBytes(3).toString('hex')}`;
  await ensureDatabase(postgres, database);
  const connection = { host: postgres.host, port: postgres.port, user: postgres.user, database };
  const db = createDb(connection, 2);
  try {
    await migrateToLatest(db);
    await runSeeds(db);
  } finally {
    await db.destroy();
  }

  return {
    connection,
    async drop() {
      await dropDatabase(postgres, database);
      if (!existsSync(startedByTests)) return;
      const client = new pg.Client({ ...connection, database: 'postgres' });
      await client.connect();
      const { rowCount } = await client.query('select 1 from pg_database where datname like $1', [
        `${PREFIX}%`,
      ]);
      await client.end();
      if (rowCount === 0) {
        rmSync(startedByTests, { force: true });
        await stopPostgresServer(dataDir);
      }
    },
  };
}
