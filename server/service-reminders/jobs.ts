import PgBoss from 'pg-boss';
import type { Logger } from 'pino';

/**
 * Service reminders run on a pg-boss schedule (a durable cron in PostgreSQL): one API process
 * runs each hourly pass however many are running, and a pass missed during a restart runs at
 * the next hour. Each reminder's own row keeps it from being sent twice.
 */
export async function startServiceReminderJobs(options: {
  connection: { host: string; port: number; database: string; user: string };
  logger: Logger;
  run: () => Promise<unknown>;
}): Promise<{ stop(): Promise<void> }> {
  const queue = 'service-reminders';
  const boss = new PgBoss({
    ...options.connection,
    max: 2,
    application_name: 'wardbook-reminders',
  });
  boss.on('error', (error) => options.logger.error({ err: error }, 'reminder job queue error'));
  await boss.start();
  await boss.createQueue(queue, { name: queue, retryLimit: 1 });
  await boss.schedule(queue, '7 * * * *', {}, { tz: 'Europe/London' });
  await boss.work(queue, { pollingIntervalSeconds: 30 }, async () => {
    options.logger.info(await options.run(), 'service reminders sent');
  });
  // Catch up now rather than wait for the hour after a start.
  await boss.send(queue, {});
  return {
    async stop() {
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
