import path from 'node:path';
import { loadConfig } from '../../server/config/config';
import type { DatabaseConnection } from '../../server/db/knex';
import { dropDatabase, ensureDatabase, startPostgres } from '../../server/db/postgres-server';

/**
 * An empty database of its own for one bench section, on the project's PostgreSQL (started if
 * need be). `finish` drops it and stops the server when this bench started it.
 */
export async function benchDatabase(
  label: string,
): Promise<{ database: DatabaseConnection; finish(): Promise<void> }> {
  const config = loadConfig();
  const postgres = await startPostgres({
    dataDir: path.join(config.dataDir, 'postgres'),
    port: config.postgres.port,
  });
  const name = `wardbook_bench_${label}_${process.pid}`;
  await dropDatabase(postgres, name);
  await ensureDatabase(postgres, name);
  return {
    database: { host: postgres.host, port: postgres.port, user: postgres.user, database: name },
    async finish() {
      await dropDatabase(postgres, name);
      await postgres.stop();
    },
  };
}

/** How long `work` took, in milliseconds, with its result. */
export async function timed<T>(work: () => Promise<T>): Promise<{ ms: number; result: T }> {
  const started = performance.now();
  const result = await work();
  return { ms: performance.now() - started, result };
}
