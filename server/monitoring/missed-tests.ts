import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { isTestOverdue, testDueBy } from '../calc/periodic-test';
import { PRIORITY } from './events';
import { notifyChange } from './live';

/**
 * Periodic tests: a panel sends a test signal (Contact ID 602, SIA RP) every so often, and when
 * none arrives in time the centre must learn that the signalling path may be down.
 *
 * Any signal counts, not only tests: an alarm, a fault or an opening got through, so the path
 * worked then, and the next test is due an interval after it (common practice, no source). A
 * site never heard from is counted from when it was recorded. Every time is taken at or before
 * the `now` given, so a sweep is a function of the database and that moment alone.
 */
export interface MissedTest {
  siteId: string;
  account: string;
  intervalMinutes: number;
  /** The last signal of any kind, or null when none is on record. */
  lastSignalAt: Date | null;
  dueBy: Date;
  /** An open missed-test fault that a later signal restored, to be reopened, if any. */
  restoredEventId: string | null;
}

/** The advisory lock that lets one receiver process sweep at a time. */
const SWEEP_LOCK = 'wardbook:missed-test-sweep';

/** Sites whose periodic test is overdue and whose operators do not already have it in hand. */
export async function findMissedTests(db: Knex, now: Date): Promise<MissedTest[]> {
  const lastSignal = db.raw(
    '(select max(g.received_at) from signals g where g.site_id = s.id and g.received_at <= ?) as last_signal_at',
    [now],
  );
  const rows: {
    id: string;
    monitoring_account: string;
    test_interval_minutes: number;
    created_at: Date;
    last_signal_at: Date | null;
    open_event_id: string | null;
  }[] = await db
    .with('watched', (query) =>
      query
        .from('sites as s')
        .leftJoin('alarm_events as e', (join) =>
          join
            .on('e.site_id', 's.id')
            .andOn('e.raised_by_missed_test', db.raw('true'))
            .andOnVal('e.status', '<>', 'closed'),
        )
        .whereNotNull('s.monitoring_centre_id')
        .whereNotNull('s.test_interval_minutes')
        // Already raised and not yet heard from since: nothing new to say.
        .where((open) => open.whereNull('e.id').orWhereNotNull('e.restored_at'))
        .select(
          's.id',
          's.monitoring_account',
          's.test_interval_minutes',
          's.created_at',
          'e.id as open_event_id',
          lastSignal,
        ),
    )
    .from('watched')
    // A cheap first cut; the grace is applied below, by the one function that defines it.
    .whereRaw(
      'coalesce(last_signal_at, created_at) < ?::timestamptz - make_interval(mins => test_interval_minutes)',
      [now],
    )
    .select('*');
  return rows
    .map((row) => {
      const lastHeardAt = row.last_signal_at ?? row.created_at;
      return {
        siteId: row.id,
        account: row.monitoring_account,
        intervalMinutes: row.test_interval_minutes,
        lastSignalAt: row.last_signal_at,
        dueBy: testDueBy(lastHeardAt, row.test_interval_minutes),
        restoredEventId: row.open_event_id,
        lastHeardAt,
      };
    })
    .filter((row) => isTestOverdue(row.lastHeardAt, row.intervalMinutes, now))
    .map(({ lastHeardAt: _lastHeardAt, ...missed }) => missed);
}

const utc = (date: Date) => `${date.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

function everyWords(minutes: number) {
  if (minutes % 1440 === 0)
    return `${minutes} minutes (${minutes / 1440 === 1 ? '24 hours' : `${minutes / 1440} days`})`;
  if (minutes % 60 === 0)
    return `${minutes} minutes (${minutes / 60 === 1 ? '1 hour' : `${minutes / 60} hours`})`;
  return `${minutes} minutes`;
}

function missedWords(missed: MissedTest, again: boolean) {
  const last = missed.lastSignalAt
    ? `last signal at ${utc(missed.lastSignalAt)}`
    : 'no signal on record';
  return `Periodic test not received${again ? ' again' : ''}: expected every ${everyWords(missed.intervalMinutes)}, ${last}.`;
}

/**
 * Raises a fault for every missed periodic test, in one transaction, and tells the operators'
 * screens through the same channel signals use. One sweep at a time holds an advisory lock:
 * `whenLocked: 'skip'` gives up this round when another process is sweeping (the timer's way),
 * 'wait' queues behind it. An open missed-test fault is never raised twice: a restored one that
 * misses again is reopened instead. Returns the events raised or reopened.
 */
export async function raiseMissedTestFaults(
  db: Knex,
  now: Date,
  { whenLocked = 'wait' }: { whenLocked?: 'wait' | 'skip' } = {},
): Promise<{ eventId: string; siteId: string; reopened: boolean }[]> {
  return db.transaction(async (trx) => {
    const { rows } = await trx.raw<{ rows: { locked: boolean }[] }>(
      whenLocked === 'skip'
        ? 'select pg_try_advisory_xact_lock(hashtext(?)) as locked'
        : 'select true as locked from pg_advisory_xact_lock(hashtext(?))',
      [SWEEP_LOCK],
    );
    if (!rows[0]?.locked) return [];
    const raised: { eventId: string; siteId: string; reopened: boolean }[] = [];
    for (const missed of await findMissedTests(trx, now)) {
      let eventId = missed.restoredEventId;
      if (eventId) {
        await trx('alarm_events')
          .where({ id: eventId })
          .update({ restored_at: null, last_signal_at: now });
      } else {
        const [created] = await trx('alarm_events')
          .insert({
            site_id: missed.siteId,
            account: missed.account,
            category: 'fault',
            priority: PRIORITY.fault,
            zones: [],
            first_signal_at: now,
            last_signal_at: now,
            raised_by_missed_test: true,
          })
          .returning<{ id: string }[]>('id');
        eventId = created!.id;
      }
      await trx('event_timeline').insert({
        event_id: eventId,
        at: now,
        kind: 'missed_test',
        text: missedWords(missed, missed.restoredEventId !== null),
      });
      await notifyChange(trx, { eventId });
      raised.push({ eventId, siteId: missed.siteId, reopened: missed.restoredEventId !== null });
    }
    return raised;
  });
}

/**
 * Sweeps once a minute from the receiver process. A timer and an advisory lock rather than a
 * pg-boss schedule: the receiver runs no job queue, a sweep is one short query, and a round
 * skipped by a process that did not get the lock is simply done by the one that did.
 */
export function startMissedTestSweep(
  db: Knex,
  logger: Logger,
  everyMs = 60_000,
): { stop(): Promise<void> } {
  let running: Promise<void> | null = null;
  const sweep = () => {
    // A slow round is not stacked on: the next tick after it finishes sweeps again.
    if (running) return;
    running = raiseMissedTestFaults(db, new Date(), { whenLocked: 'skip' })
      .then((raised) => {
        if (raised.length) logger.warn({ raised }, 'periodic tests missed');
      })
      .catch((error: unknown) => logger.error({ err: error }, 'missed-test sweep failed'))
      .finally(() => {
        running = null;
      });
  };
  const timer = setInterval(sweep, everyMs);
  timer.unref();
  sweep();
  return {
    async stop() {
      clearInterval(timer);
      await running;
    },
  };
}
