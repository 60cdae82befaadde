import PgBoss from 'pg-boss';
import type { Knex } from 'knex';
import type { Logger } from 'pino';
import type { SmsSender } from '../../sms/sender';
import { createLiveFeed } from '../live';
import { notifyChange } from '../live';
import { escalateIfUnanswered } from './service';

/**
 * Works through the keyholder outbox: sends each queued text once through Twilio, records what
 * came back, and books the durable escalation job that moves on if nobody accepts in time.
 * Any number of API processes may run one; a row is claimed with SKIP LOCKED before sending.
 */
export interface CallOutEngine {
  /** Look at the outbox now rather than at the next poll. */
  kick(): void;
  /** Sends everything queued now and resolves when done (for tests and benches). */
  drain(): Promise<void>;
  stop(): Promise<void>;
}

export interface CallOutEngineOptions {
  /** An API process may leave sending to others; its routes still queue texts. */
  enabled?: boolean;
  db: Knex;
  logger: Logger;
  sms: SmsSender;
  /** The app's status-callback webhook; the message's id is added as `?message=`. */
  statusCallbackUrl: string;
  connection: { host: string; port: number; database: string; user: string };
  /** One queue per test app; the default is shared by every API process. */
  queueName?: string;
  /** How long to wait for an acceptance, given the centre's minutes. */
  escalationDelaySeconds?: (waitMinutes: number) => number;
  /** A send still unconfirmed after this long was cut short by a crash. */
  stuckAfterSeconds?: number;
  pollMs?: number;
}

interface OutboxRow {
  id: string;
  event_id: string;
  keyholder_name: string;
  phone: string;
  body: string;
  reference: string;
  attempts: number;
}

/** Network trouble is retried; a refusal from Twilio (a bad number, say) is not. */
const MAX_ATTEMPTS = 5;

export async function startCallOutEngine(options: CallOutEngineOptions): Promise<CallOutEngine> {
  if (options.enabled === false) {
    return { kick() {}, async drain() {}, async stop() {} };
  }
  const { db, logger, sms } = options;
  const queue = options.queueName ?? 'keyholder-escalation';
  const delaySeconds = options.escalationDelaySeconds ?? ((minutes: number) => minutes * 60);
  const stuckAfter = options.stuckAfterSeconds ?? 60;

  const boss = new PgBoss({ ...options.connection, max: 2, application_name: 'wardbook-callout' });
  boss.on('error', (error) => logger.error({ err: error }, 'call-out job queue error'));
  await boss.start();
  await boss.createQueue(queue, { name: queue, retryLimit: 3, retryDelay: 5 });
  await boss.work<{ messageId: string }>(
    queue,
    { pollingIntervalSeconds: 1, batchSize: 1 },
    async ([job]) => {
      if (!job) return;
      if (await escalateIfUnanswered(db, job.data.messageId)) kick();
    },
  );

  async function bookEscalation(messageId: string) {
    const row = await db('keyholder_messages as m')
      .join('alarm_events as e', 'e.id', 'm.event_id')
      .join('sites as s', 's.id', 'e.site_id')
      .join('organisations as c', 'c.id', 's.monitoring_centre_id')
      .where('m.id', messageId)
      .first('c.callout_wait_minutes');
    const jobId = await boss.send(
      queue,
      { messageId },
      { startAfter: delaySeconds(Number(row?.callout_wait_minutes ?? 5)) },
    );
    await db('keyholder_messages').where({ id: messageId }).update({ escalation_job_id: jobId });
  }

  async function markSent(row: OutboxRow, sid: string) {
    const booked = await db.transaction(async (trx) => {
      // A delivery callback can beat this update; it has then recorded the status already.
      const updated = await trx('keyholder_messages')
        .where({ id: row.id, status: 'sending' })
        .update({ status: 'sent', provider_sid: sid, sent_at: trx.fn.now(), error: null });
      if (updated) {
        await trx('event_timeline').insert({
          event_id: row.event_id,
          kind: 'message',
          text: `Text to ${row.keyholder_name} sent.`,
        });
        await notifyChange(trx, { eventId: row.event_id });
      }
      const current = await trx('keyholder_messages')
        .where({ id: row.id })
        .first('escalation_job_id', 'status');
      return (
        current.escalation_job_id !== null || ['failed', 'undelivered'].includes(current.status)
      );
    });
    if (!booked) await bookEscalation(row.id);
  }

  async function markFailed(row: OutboxRow, reason: string) {
    await db.transaction(async (trx) => {
      await trx('keyholder_messages')
        .where({ id: row.id })
        .update({ status: 'failed', error: reason });
      await trx('event_timeline').insert({
        event_id: row.event_id,
        kind: 'message',
        text: `Text to ${row.keyholder_name} could not be sent: ${reason}`,
      });
      await notifyChange(trx, { eventId: row.event_id });
    });
    // Nobody will answer a text that never left: move on now.
    await escalateIfUnanswered(db, row.id);
  }

  async function send(row: OutboxRow) {
    const statusCallback = `${options.statusCallbackUrl}?message=${row.id}`;
    try {
      const sid = await sms.send({ to: row.phone, body: row.body, statusCallback });
      await markSent(row, sid);
    } catch (error) {
      const status = (error as { status?: number }).status;
      const message = (error as Error).message;
      if (status && status >= 400 && status < 500) {
        await markFailed(row, message);
      } else if (row.attempts >= MAX_ATTEMPTS) {
        await markFailed(row, `no answer from the SMS provider after ${row.attempts} tries`);
      } else {
        logger.warn({ err: error, messageId: row.id }, 'text not sent; will try again');
        await db('keyholder_messages')
          .where({ id: row.id, status: 'sending' })
          .update({ status: 'queued', error: message });
      }
    }
  }

  /**
   * A process that died between claiming a text and recording Twilio's answer leaves it
   * "sending". Twilio has no idempotency key, so ask it whether a text with this message's
   * reference went out before sending it again: no message lost, none sent twice.
   */
  async function recoverStuck() {
    const stuck: OutboxRow[] = await db('keyholder_messages')
      .where({ status: 'sending' })
      .where('claimed_at', '<', db.raw('now() - make_interval(secs => ?)', [stuckAfter]))
      .select('id', 'event_id', 'keyholder_name', 'phone', 'body', 'reference', 'attempts');
    for (const row of stuck) {
      const sid = await sms.findSent(row.phone, `Ref ${row.reference}`);
      if (sid) await markSent(row, sid);
      else
        await db('keyholder_messages')
          .where({ id: row.id, status: 'sending' })
          .update({ status: 'queued' });
    }
    // Sent, but the process died before booking the job that moves on.
    const unbooked: string[] = await db('keyholder_messages as m')
      .join('alarm_events as e', 'e.id', 'm.event_id')
      .whereIn('m.status', ['sent', 'delivered'])
      .whereNull('m.escalation_job_id')
      .where('e.callout_status', 'calling')
      .where('m.sent_at', '<', db.raw('now() - make_interval(secs => ?)', [stuckAfter]))
      .pluck('m.id');
    for (const id of unbooked) await bookEscalation(id);
  }

  async function claimNext(): Promise<OutboxRow | null> {
    return db.transaction(async (trx) => {
      const row = await trx('keyholder_messages')
        .where({ status: 'queued' })
        .orderBy('queued_at')
        .forUpdate()
        .skipLocked()
        .first('id', 'event_id', 'keyholder_name', 'phone', 'body', 'reference', 'attempts');
      if (!row) return null;
      await trx('keyholder_messages')
        .where({ id: row.id })
        .update({ status: 'sending', attempts: row.attempts + 1, claimed_at: trx.fn.now() });
      return { ...row, attempts: row.attempts + 1 } as OutboxRow;
    });
  }

  let running: Promise<void> | null = null;
  let again = false;
  let stopped = false;

  async function workThrough() {
    do {
      again = false;
      await recoverStuck();
      for (let row = await claimNext(); row && !stopped; row = await claimNext()) await send(row);
    } while (again && !stopped);
  }

  function kick() {
    if (stopped) return;
    if (running) {
      again = true;
      return;
    }
    running = workThrough()
      .catch((error) => logger.error({ err: error }, 'keyholder outbox pass failed'))
      .finally(() => {
        running = null;
      });
  }

  // Changes made by other processes (the receiver's automatic call-outs) arrive as NOTIFYs.
  const feed = createLiveFeed(db, logger);
  const unsubscribe = feed.subscribe(() => kick());
  const poll = setInterval(kick, options.pollMs ?? 2000);
  kick();

  return {
    kick,
    async drain() {
      kick();
      while (running) await running;
    },
    async stop() {
      stopped = true;
      clearInterval(poll);
      unsubscribe();
      while (running) await running;
      await boss.stop({ graceful: true, wait: true, timeout: 10_000 });
    },
  };
}
