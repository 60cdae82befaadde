import pg from 'pg';
import { afterAll, describe, expect, inject, it } from 'vitest';
import { findMissedTests, raiseMissedTestFaults } from '../../server/monitoring/missed-tests';
import { handleFrame } from '../../server/monitoring/receiver';
import { SIGNALS_CHANNEL } from '../../server/monitoring/repository';
import { simulatedFrame } from '../../server/monitoring/simulator';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation } from '../setup/factories';
import { createSiteRecord } from '../setup/site-fixtures';

/**
 * The missed periodic test sweep, driven with explicit `now` values. Each test makes its own
 * sites, and its times stay within hours of the clock, so the other files' sites (whose test
 * intervals, if any, run to a day) are never due in these sweeps.
 */
const db = testDb();
afterAll(closeTestDb);

const MINUTE = 60_000;
const at = (base: Date, minutes: number) => new Date(base.getTime() + minutes * MINUTE);
/** A start time on a whole minute, so the texts are predictable. */
const T0 = new Date(Math.floor(Date.now() / MINUTE) * MINUTE);

async function monitoredSite(testIntervalMinutes: number | null, monitored = true) {
  const installer = await createOrganisation(db, 'installer');
  const centre = monitored ? await createOrganisation(db, 'monitoring_centre') : undefined;
  const { siteId } = await createSiteRecord(db, {
    installerId: installer.id,
    monitoringCentreId: centre?.id,
  });
  const [site] = await db('sites')
    .where({ id: siteId })
    .update({ test_interval_minutes: testIntervalMinutes })
    .returning<{ id: string; monitoring_account: string; created_at: Date }[]>([
      'id',
      'monitoring_account',
      'created_at',
    ]);
  return site!;
}

let sequence = 300;
/** A signal from the site's panel through the receiver, then dated `receivedAt`. */
async function signalFrom(
  site: { monitoring_account: string },
  code: string,
  receivedAt: Date,
  qualifier: 'new' | 'restore' = 'new',
) {
  const frame = simulatedFrame({
    format: 'adm-cid',
    account: site.monitoring_account,
    code,
    zone: code === '602' ? 0 : 4,
    partition: 1,
    qualifier,
    sequence: sequence++,
    receiver: '1',
    linePrefix: '1',
  });
  const { outcome } = await handleFrame({ db }, frame);
  if (!outcome.startsWith('ack:')) throw new Error(`the receiver answered ${outcome}`);
  const [signal] = await db('signals')
    .where({ raw: frame })
    .update({ received_at: receivedAt })
    .returning<{ id: string; event_id: string | null }[]>(['id', 'event_id']);
  return signal!;
}

/** Sweeps at `now` and returns the one event raised for the site. */
async function raisedFor(siteId: string, now: Date) {
  const raised = (await raiseMissedTestFaults(db, now)).filter((r) => r.siteId === siteId);
  if (raised.length !== 1) throw new Error(`expected one fault for the site, got ${raised.length}`);
  return raised[0]!.eventId;
}
const missedFor = async (siteId: string, now: Date) =>
  (await findMissedTests(db, now)).filter((missed) => missed.siteId === siteId);
const eventsOf = (siteId: string) =>
  db('alarm_events').where({ site_id: siteId }).orderBy('first_signal_at');
const timelineOf = (eventId: string) =>
  db('event_timeline').where({ event_id: eventId }).orderBy('id').select('at', 'kind', 'text');

/** Collects the NOTIFY payloads on the signals channel while `work` runs. */
async function notificationsDuring(work: () => Promise<unknown>) {
  const client = new pg.Client(inject('database'));
  await client.connect();
  const payloads: { eventId: string | null }[] = [];
  client.on('notification', (message) => payloads.push(JSON.parse(message.payload!)));
  await client.query(`listen ${SIGNALS_CHANNEL}`);
  try {
    await work();
    // A round trip after the commit: every notification sent before it has arrived.
    await client.query('select 1');
    return payloads;
  } finally {
    await client.end();
  }
}

describe('the missed periodic test sweep', () => {
  it('raises one fault when a test is over its interval and grace, and tells the screens', async () => {
    const site = await monitoredSite(60);
    await signalFrom(site, '602', T0);
    // 60 minutes and a grace of 6 (10 %, at least 5; common practice, no source).
    expect(await missedFor(site.id, at(T0, 65))).toEqual([]);
    expect(await missedFor(site.id, at(T0, 66))).toEqual([]);
    expect(await missedFor(site.id, at(T0, 67))).toEqual([
      {
        siteId: site.id,
        account: site.monitoring_account,
        intervalMinutes: 60,
        lastSignalAt: T0,
        dueBy: at(T0, 66),
        restoredEventId: null,
      },
    ]);

    let raised: Awaited<ReturnType<typeof raiseMissedTestFaults>> = [];
    const notified = await notificationsDuring(async () => {
      raised = (await raiseMissedTestFaults(db, at(T0, 67))).filter((r) => r.siteId === site.id);
    });
    expect(raised).toEqual([{ eventId: expect.any(String), siteId: site.id, reopened: false }]);
    const [event] = await eventsOf(site.id);
    expect(event).toMatchObject({
      id: raised[0]!.eventId,
      account: site.monitoring_account,
      category: 'fault',
      priority: 5,
      status: 'open',
      raised_by_missed_test: true,
      restored_at: null,
    });
    expect(event.first_signal_at).toEqual(at(T0, 67));
    const hhmm = T0.toISOString().slice(0, 16).replace('T', ' ');
    expect(await timelineOf(event.id)).toEqual([
      {
        at: at(T0, 67),
        kind: 'missed_test',
        text: `Periodic test not received: expected every 60 minutes (1 hour), last signal at ${hhmm} UTC.`,
      },
    ]);
    expect(notified).toContainEqual({ eventId: event.id });

    // Later sweeps leave it be: one open fault, not one a minute.
    await raiseMissedTestFaults(db, at(T0, 68));
    await raiseMissedTestFaults(db, at(T0, 180));
    expect(await eventsOf(site.id)).toHaveLength(1);
  });

  it('notes the test coming back on the fault, and reopens the same fault if it goes quiet again', async () => {
    const site = await monitoredSite(60);
    await signalFrom(site, '602', T0);
    const eventId = await raisedFor(site.id, at(T0, 70));

    const back = await signalFrom(site, '602', at(T0, 90));
    expect(back.event_id).toBe(eventId);
    const restored = await db('alarm_events').where({ id: eventId }).first();
    expect(restored.restored_at).not.toBeNull();
    expect((await timelineOf(eventId)).map((entry) => entry.text)).toEqual([
      expect.stringMatching(/^Periodic test not received: /),
      'Periodic test received again.',
    ]);
    expect(await missedFor(site.id, at(T0, 90 + 66))).toEqual([]);

    const again = (await raiseMissedTestFaults(db, at(T0, 90 + 67))).filter(
      (r) => r.siteId === site.id,
    );
    expect(again).toEqual([{ eventId, siteId: site.id, reopened: true }]);
    expect(await eventsOf(site.id)).toHaveLength(1);
    expect((await db('alarm_events').where({ id: eventId }).first()).restored_at).toBeNull();
    expect((await timelineOf(eventId)).at(-1)!.text).toMatch(
      /^Periodic test not received again: expected every 60 minutes \(1 hour\), last signal at /,
    );
  });

  it('counts any signal as proof of the path, and notes one arriving after a fault', async () => {
    const site = await monitoredSite(120);
    await signalFrom(site, '602', T0);
    // An opening (Contact ID 401) 100 minutes later: the path worked then.
    await signalFrom(site, '401', at(T0, 100));
    // Grace for 120 minutes: 12.
    expect(await missedFor(site.id, at(T0, 133))).toEqual([]);
    expect(await missedFor(site.id, at(T0, 100 + 133))).toEqual([
      expect.objectContaining({ lastSignalAt: at(T0, 100), dueBy: at(T0, 100 + 132) }),
    ]);
    const eventId = await raisedFor(site.id, at(T0, 100 + 133));
    // An intruder alarm comes through: its own event, and a note on the fault.
    const alarm = await signalFrom(site, '130', at(T0, 240));
    expect(alarm.event_id).not.toBe(eventId);
    expect((await timelineOf(eventId)).at(-1)!.text).toBe(
      'A signal came through, so the signalling path works again; the periodic test is still to come.',
    );
  });

  it('keeps fault signals and their restores off the missed-test fault', async () => {
    const site = await monitoredSite(60);
    await signalFrom(site, '602', T0);
    const eventId = await raisedFor(site.id, at(T0, 70));
    await db('alarm_events').where({ id: eventId }).update({ restored_at: null });
    // Mains failure (Contact ID 301), new: a fault of its own, not joined to the missed test.
    const mains = await signalFrom(site, '301', at(T0, 71));
    expect(mains.event_id).not.toBe(eventId);
    const mainsRestore = await signalFrom(site, '301', at(T0, 72), 'restore');
    expect(mainsRestore.event_id).toBe(mains.event_id);
    const missedTest = await db('alarm_events').where({ id: eventId }).first();
    expect(missedTest.zones).toEqual([]);
  });

  it('counts a site never heard from from when it was recorded, and leaves other sites alone', async () => {
    const silent = await monitoredSite(30);
    const noInterval = await monitoredSite(null);
    const unmonitored = await monitoredSite(30, false);
    const now = at(silent.created_at, 36);
    const raised = await raiseMissedTestFaults(db, now);
    const sites = raised.map((r) => r.siteId);
    expect(sites).toContain(silent.id);
    expect(sites).not.toContain(noInterval.id);
    expect(sites).not.toContain(unmonitored.id);
    const [event] = await eventsOf(silent.id);
    expect((await timelineOf(event.id))[0]!.text).toBe(
      'Periodic test not received: expected every 30 minutes, no signal on record.',
    );
  });

  it('raises a new fault once the operator has closed the last one', async () => {
    const site = await monitoredSite(120);
    await signalFrom(site, '602', T0);
    // Two hours and 12 minutes' grace.
    const first = (await raiseMissedTestFaults(db, at(T0, 133))).filter(
      (r) => r.siteId === site.id,
    );
    expect(first).toHaveLength(1);
    expect((await timelineOf(first[0]!.eventId))[0]!.text).toContain('every 120 minutes (2 hours)');
    await db('alarm_events').where({ id: first[0]!.eventId }).update({ status: 'closed' });
    const second = (await raiseMissedTestFaults(db, at(T0, 134))).filter(
      (r) => r.siteId === site.id,
    );
    expect(second).toEqual([{ eventId: expect.any(String), siteId: site.id, reopened: false }]);
    expect(second[0]!.eventId).not.toBe(first[0]!.eventId);
  });

  it('lets one sweep run at a time: a second skips, or waits and finds nothing new', async () => {
    const site = await monitoredSite(60);
    await signalFrom(site, '602', T0);
    const now = at(T0, 70);
    // While another process holds the sweep lock, a skipping sweep does nothing.
    const skipped = await db.transaction(async (trx) => {
      await trx.raw('select pg_advisory_xact_lock(hashtext(?))', ['wardbook:missed-test-sweep']);
      return raiseMissedTestFaults(db, now, { whenLocked: 'skip' });
    });
    expect(skipped).toEqual([]);
    expect(await eventsOf(site.id)).toHaveLength(0);
    // Two at once that wait: one raises the fault, the other then finds it open.
    const both = await Promise.all([
      raiseMissedTestFaults(db, now),
      raiseMissedTestFaults(db, now),
    ]);
    expect(both.flat().filter((r) => r.siteId === site.id)).toHaveLength(1);
    expect(await eventsOf(site.id)).toHaveLength(1);
  });
});
