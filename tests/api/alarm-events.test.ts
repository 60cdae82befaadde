import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { handleFrame } from '../../server/monitoring/receiver';
import { simulatedFrame, type SimulatedSignal } from '../../server/monitoring/simulator';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation } from '../setup/factories';
import { createSiteRecord } from '../setup/site-fixtures';

const db = testDb();
afterAll(closeTestDb);

let sequence = 100;
async function signal(account: string, overrides: Partial<SimulatedSignal> = {}) {
  const frame = simulatedFrame({
    format: 'adm-cid',
    account,
    code: '130',
    zone: 1,
    partition: 1,
    qualifier: 'new',
    sequence: sequence++,
    receiver: '1',
    linePrefix: '1',
    ...overrides,
  });
  const { outcome } = await handleFrame({ db }, frame);
  expect(outcome).toMatch(/^ack:/);
  return db('signals').where({ raw: frame }).first();
}

async function monitoredSite() {
  const installer = await createOrganisation(db, 'installer');
  const centre = await createOrganisation(db, 'monitoring_centre');
  const site = await createSiteRecord(db, {
    installerId: installer.id,
    monitoringCentreId: centre.id,
  });
  const row = await db('sites').where({ id: site.siteId }).first();
  return { siteId: site.siteId, account: row.monitoring_account as string };
}

const timeline = async (eventId: string) =>
  db('event_timeline').where({ event_id: eventId }).orderBy('id').pluck('kind');

describe('alarm events from signals', () => {
  let site: { siteId: string; account: string };
  beforeAll(async () => {
    site = await monitoredSite();
  });

  it('opens an unconfirmed intruder event, then confirms it when a second detector trips', async () => {
    const first = await signal(site.account, { zone: 2 });
    const event = await db('alarm_events').where({ id: first.event_id }).first();
    expect(event).toMatchObject({
      site_id: site.siteId,
      category: 'burglary',
      confirmed: false,
      priority: 3,
      zones: [2],
      status: 'open',
    });
    // The same detector again does not confirm (BS 8243: a second, different detector).
    await signal(site.account, { zone: 2 });
    expect((await db('alarm_events').where({ id: event.id }).first()).confirmed).toBe(false);
    const second = await signal(site.account, { zone: 5 });
    expect(second.event_id).toBe(event.id);
    expect(await db('alarm_events').where({ id: event.id }).first()).toMatchObject({
      confirmed: true,
      priority: 2,
      zones: [2, 5],
    });
    expect(await timeline(event.id)).toEqual(['received', 'signal', 'confirmed']);
  });

  it('marks the event restored when the zone restores', async () => {
    const restore = await signal(site.account, { zone: 5, qualifier: 'restore' });
    const event = await db('alarm_events').where({ id: restore.event_id }).first();
    expect(event.restored_at).not.toBeNull();
    expect((await timeline(event.id)).at(-1)).toBe('restored');
  });

  it('does not confirm outside the site’s window', async () => {
    const other = await monitoredSite();
    const first = await signal(other.account, { zone: 1 });
    // The first detector tripped 31 minutes ago; the window is 30 minutes.
    await db('alarm_events')
      .where({ id: first.event_id })
      .update({ first_signal_at: db.raw("now() - interval '31 minutes'") });
    const second = await signal(other.account, { zone: 4 });
    expect(second.event_id).not.toBe(first.event_id);
    expect((await db('alarm_events').where({ id: second.event_id }).first()).confirmed).toBe(false);
  });

  it('puts hold-up and fire first, and files tests and open/close without an event', async () => {
    const other = await monitoredSite();
    const holdUp = await signal(other.account, { code: '120', zone: 9 });
    const fire = await signal(other.account, { code: '110', zone: 8 });
    const tamper = await signal(other.account, { code: '137', zone: 3 });
    const fault = await signal(other.account, { code: '301', zone: 0 });
    const priorities = await Promise.all(
      [holdUp, fire, tamper, fault].map(
        async (row) => (await db('alarm_events').where({ id: row.event_id }).first()).priority,
      ),
    );
    expect(priorities).toEqual([1, 1, 4, 5]);
    const test = await signal(other.account, { code: '602', zone: 0 });
    const closing = await signal(other.account, { code: '401', zone: 2 });
    expect([test.event_id, closing.event_id]).toEqual([null, null]);
  });

  it('opens a flagged event for an account no site holds', async () => {
    const row = await signal('ABCDEF01', { zone: 1 });
    const event = await db('alarm_events').where({ id: row.event_id }).first();
    expect(event.site_id).toBeNull();
    const [received] = await db('event_timeline').where({ event_id: event.id }).pluck('text');
    expect(received).toMatch(/no site has this account/);
  });
});
