import PgBoss from 'pg-boss';
import type { Logger } from 'pino';

/**
 * Packs are built off the request path, on pg-boss (durable jobs in PostgreSQL): an issue
 * request returns at once, any API process may do the build, and a build survives a restart.
 */
export interface PackBuildQueue {
  enqueue(buildId: string): Promise<void>;
  stop(): Promise<void>;
}

export async function startPackBuildQueue(options: {
  connection: { host: string; port: number; database: string; user: string };
  logger: Logger;
  run: (buildId: string) => Promise<void>;
  /** One queue per test app, so that each builds only its own packs (tests use separate disks). */
  queueName?: string;
}): Promise<PackBuildQueue> {
  const queue = options.queueName ?? 'issue-pack';
  const boss = new PgBoss({ ...options.connection, max: 3, application_name: 'wardbook-jobs' });
  boss.on('error', (error) => options.logger.error({ err: error }, 'job queue error'));
  await boss.start();
  await boss.createQueue(queue, { name: queue, retryLimit: 0 });
  const workerId = await boss.work<{ buildId: string }>(
    queue,
    { pollingIntervalSeconds: 2, batchSize: 1 },
    async ([job]) => {
      if (job) await options.run(job.data.buildId);
    },
  );
  return {
    async enqueue(buildId) {
      await boss.send(queue, { buildId });
      // Wake this process's worker now rather than at its next poll.
      boss.notifyWorker(workerId);
    },
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
