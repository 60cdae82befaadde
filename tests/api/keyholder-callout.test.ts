import { randomBytes } from 'node:crypto';
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import twilio from 'twilio';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { LOCAL_TWILIO_ACCOUNT_SID, LOCAL_TWILIO_FROM } from '../../server/config/config';
import { createTwilioFake, type TwilioFake } from '../../server/fakes/twilio/app';
import { startCallOutEngine, type CallOutEngine } from '../../server/monitoring/callout/engine';
import { createSmsSender } from '../../server/sms/sender';
import { buildApiHarness, type ApiHarness } from '../setup/api-app';
import { closeTestDb, testDb } from '../setup/database';
import { createPerson } from '../setup/factories';
import { alarmFromSite } from '../setup/monitoring-fixtures';
import { createSiteWorld, type SiteWorld } from '../setup/site-fixtures';

/*
 * Keyholder call-out end to end inside one process: the app listening on a real port, the
 * local Twilio fake (driven by the real twilio SDK), and the outbox sender with its durable
 * escalation jobs. This is the only API test file that runs a sender: files share a database.
 * Every phone number is in Ofcom's drama range.
 */

const db = testDb();
const authToken = randomBytes(16).toString('hex');
let appServer: Server;
let fakeServer: Server;
let publicUrl: string;
let fakeUrl: string;
let fake: TwilioFake;
let engine: CallOutEngine;
let harness: ApiHarness;
let world: SiteWorld;

function listen(server: Server) {
  return new Promise<string>((resolve) =>
    server.listen(0, '127.0.0.1', () =>
      resolve(`http://127.0.0.1:${(server.address() as AddressInfo).port}`),
    ),
  );
}

async function close(server: Server) {
  server.closeAllConnections();
  await new Promise((resolve) => server.close(resolve));
}

let phoneCounter = 100;
/** Each test's keyholders get their own numbers, so a reply can only answer that test's text. */
async function freshKeyholders(siteId: string, count: number) {
  await db('keyholders').where({ site_id: siteId }).delete();
  const rows = Array.from({ length: count }, (_, index) => ({
    site_id: siteId,
    call_order: index + 1,
    name: `Keyholder ${index + 1}`,
    phone: `+447700900${String(phoneCounter++).padStart(3, '0')}`,
    minutes_to_attend: 10 + index,
    user_id: index === 0 ? world.keyholder.userId : null,
  }));
  await db('keyholders').insert(rows);
  return rows.map((row) => row.phone);
}

beforeAll(async () => {
  appServer = createServer();
  publicUrl = await listen(appServer);
  fakeServer = createServer();
  fakeUrl = await listen(fakeServer);
  fake = createTwilioFake({
    accountSid: LOCAL_TWILIO_ACCOUNT_SID,
    authToken,
    publicUrl: fakeUrl,
    inboundWebhookUrl: `${publicUrl}/api/webhooks/twilio/inbound`,
    phoneNumber: LOCAL_TWILIO_FROM,
    statusStepMs: 10,
  });
  fakeServer.on('request', fake.app);
  engine = await startCallOutEngine({
    db,
    logger: (await import('../../server/http/logger')).createLogger('silent', 'test'),
    sms: createSmsSender({
      accountSid: LOCAL_TWILIO_ACCOUNT_SID,
      authToken,
      from: LOCAL_TWILIO_FROM,
      apiBaseUrl: fakeUrl,
    }),
    statusCallbackUrl: `${publicUrl}/api/webhooks/twilio/status`,
    connection: (await import('vitest')).inject('database'),
    queueName: `keyholder-escalation-${randomBytes(6).toString('hex')}`,
    // The centre's minutes become seconds here, so escalation is seen within a test.
    escalationDelaySeconds: (minutes) => minutes,
    stuckAfterSeconds: 30,
    pollMs: 500,
  });
  harness = await buildApiHarness(db, { publicUrl, twilioAuthToken: authToken, callOut: engine });
  appServer.on('request', harness.app);
  world = await createSiteWorld(db);
  await db('organisations').where({ id: world.centre.id }).update({ callout_wait_minutes: 2 });
});

afterAll(async () => {
  fake.close();
  await engine.stop();
  await harness.close();
  await Promise.all([close(appServer), close(fakeServer)]);
  await closeTestDb();
});

// A test that fails part-way must not leave its event open: the next alarm would join it.
afterEach(async () => {
  await db('alarm_events')
    .where({ site_id: world.own.siteId })
    .whereNot({ status: 'closed' })
    .update({ status: 'closed', closed_at: db.fn.now(), outcome: 'test_or_engineer' });
});

const asOperator = () => harness.signedInAs(world.operator.userId);

async function takenAlarm(zone = 1) {
  const eventId = await alarmFromSite(db, world.own.siteId, zone);
  const operator = await asOperator();
  await operator.agent
    .post(`/api/monitoring/events/${eventId}/take`)
    .set('x-csrf-token', operator.csrfToken)
    .expect(200);
  return { eventId, ...operator };
}

async function closeEvent(eventId: string) {
  const { agent, csrfToken } = await asOperator();
  await agent
    .post(`/api/monitoring/events/${eventId}/close`)
    .set('x-csrf-token', csrfToken)
    .send({ outcome: 'false_alarm_user' })
    .expect(200);
}

const textsTo = (phone: string) =>
  fake.inbox.list().filter((message) => message.direction === 'outbound' && message.to === phone);

async function timelineOf(eventId: string): Promise<string[]> {
  return db('event_timeline').where({ event_id: eventId }).orderBy('id').pluck('text');
}

describe('messaging keyholders', () => {
  it('needs the event taken first, then texts the first keyholder with no address or codes', async () => {
    const [first] = await freshKeyholders(world.own.siteId, 2);
    const eventId = await alarmFromSite(db, world.own.siteId, 1);
    const { agent, csrfToken } = await asOperator();
    const early = await agent
      .post(`/api/monitoring/events/${eventId}/call-out`)
      .set('x-csrf-token', csrfToken)
      .send({});
    expect(early.status).toBe(409);
    expect(early.body.detail).toMatch(/take the event/i);
    await agent.post(`/api/monitoring/events/${eventId}/take`).set('x-csrf-token', csrfToken);

    const started = await agent
      .post(`/api/monitoring/events/${eventId}/call-out`)
      .set('x-csrf-token', csrfToken)
      .send({});
    expect(started.status).toBe(200);
    expect(started.body.callOut.status).toBe('calling');
    expect(started.body.callOut.messages).toHaveLength(1);

    await expect.poll(() => textsTo(first!).length, { timeout: 10_000 }).toBe(1);
    const text = textsTo(first!)[0]!;
    const site = await db('sites').where({ id: world.own.siteId }).first();
    expect(text.body).toContain(site.name);
    expect(text.body).toContain('Eastmere');
    // No street address, postcode, account number or alarm code travels by text.
    expect(text.body).not.toContain('Test Street');
    expect(text.body).not.toContain('EM1');
    expect(text.body).not.toContain(site.monitoring_account);
    expect(text.body).not.toMatch(/\b1[0-9]{2}\b/);
    expect(text.body).toMatch(/signs of forced entry/);

    await expect
      .poll(
        async () => (await db('keyholder_messages').where({ event_id: eventId }).first()).status,
      )
      .toBe('delivered');
    expect(await timelineOf(eventId)).toEqual(
      expect.arrayContaining([
        'Text to Keyholder 1 (1st in the call plan) queued.',
        'Text to Keyholder 1 sent.',
        'Text to Keyholder 1 delivered.',
      ]),
    );

    const again = await agent
      .post(`/api/monitoring/events/${eventId}/call-out`)
      .set('x-csrf-token', csrfToken)
      .send({});
    expect(again.status).toBe(409);
    await closeEvent(eventId);
  });

  it('takes a reply of "1" as attending, and ends the call-out', async () => {
    const [first, second] = await freshKeyholders(world.own.siteId, 2);
    const { eventId, agent, csrfToken } = await takenAlarm();
    await agent.post(`/api/monitoring/events/${eventId}/call-out`).set('x-csrf-token', csrfToken);
    await expect.poll(() => textsTo(first!).length).toBe(1);

    await fake.replyAs({ from: first!, body: ' 1 on my way' });
    await expect
      .poll(async () => (await db('alarm_events').where({ id: eventId }).first()).callout_status)
      .toBe('accepted');
    const { body } = await agent.get(`/api/monitoring/events/${eventId}`);
    expect(body.callOut).toMatchObject({ status: 'accepted', attending: 'Keyholder 1' });
    expect(body.callOut.messages[0]).toMatchObject({ reply: 'attending' });
    expect(await timelineOf(eventId)).toContain(
      'Keyholder 1 replied 1: attending (about 10 minutes away).',
    );
    // The reply's answer to the keyholder repeats the caution.
    const answer = fake.inbox
      .list()
      .find((message) => message.direction === 'inbound' && message.from === first);
    expect(answer).toBeDefined();

    // Nobody else is texted after an acceptance, even when the wait runs out.
    await new Promise((resolve) => setTimeout(resolve, 3000));
    expect(textsTo(second!)).toHaveLength(0);
    await closeEvent(eventId);
  });

  it('moves to the next keyholder when nobody accepts in time, then says the plan is used up', async () => {
    const [first, second] = await freshKeyholders(world.own.siteId, 2);
    const { eventId, agent, csrfToken } = await takenAlarm();
    await agent.post(`/api/monitoring/events/${eventId}/call-out`).set('x-csrf-token', csrfToken);
    await expect.poll(() => textsTo(first!).length).toBe(1);
    // The durable job runs after the centre's wait and texts the second keyholder.
    await expect.poll(() => textsTo(second!).length, { timeout: 20_000 }).toBe(1);
    expect(await timelineOf(eventId)).toContain('No acceptance from Keyholder 1 within 2 minutes.');

    await fake.replyAs({ from: second!, body: '2' });
    await expect
      .poll(async () => (await db('alarm_events').where({ id: eventId }).first()).callout_status)
      .toBe('exhausted');
    expect(await timelineOf(eventId)).toEqual(
      expect.arrayContaining([
        'Keyholder 2 replied 2: cannot attend.',
        'No keyholder has accepted and the call plan is used up: phone the keyholders.',
      ]),
    );
    expect(textsTo(first!)).toHaveLength(1);
    await closeEvent(eventId);
  }, 40_000);

  it('passes over a keyholder who is away today', async () => {
    const [first, second] = await freshKeyholders(world.own.siteId, 2);
    const today = new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London' }).format(
      new Date(),
    );
    await db('keyholders')
      .where({ site_id: world.own.siteId, call_order: 1 })
      .update({ unavailable: JSON.stringify([{ from: today, to: today, note: 'on holiday' }]) });
    const { eventId, agent, csrfToken } = await takenAlarm();
    await agent.post(`/api/monitoring/events/${eventId}/call-out`).set('x-csrf-token', csrfToken);
    await expect.poll(() => textsTo(second!).length).toBe(1);
    expect(textsTo(first!)).toHaveLength(0);
    expect(await timelineOf(eventId)).toContain(
      'Passed over Keyholder 1 (1st in the call plan): on holiday.',
    );
    await closeEvent(eventId);
  });
  it('texts the first keyholder straight from the signal where the centre chooses that', async () => {
    const [first] = await freshKeyholders(world.own.siteId, 1);
    await db('organisations').where({ id: world.centre.id }).update({ callout_automatic: true });
    try {
      const eventId = await alarmFromSite(db, world.own.siteId, 1);
      // The receiver queued it in the signal's own transaction; the sender hears the NOTIFY.
      await expect.poll(() => textsTo(first!).length).toBe(1);
      expect((await db('alarm_events').where({ id: eventId }).first()).callout_status).toBe(
        'calling',
      );
      expect(await timelineOf(eventId)).toContain(
        'Messaging keyholders automatically, 2 minutes for each to accept.',
      );
      await db('alarm_events')
        .where({ id: eventId })
        .update({ status: 'taken', taken_by: world.operator.userId });
      await closeEvent(eventId);
    } finally {
      await db('organisations').where({ id: world.centre.id }).update({ callout_automatic: false });
    }
  });
});

describe('Twilio webhooks', () => {
  it('refuse unsigned and forged requests with 403 and change nothing', async () => {
    const [first] = await freshKeyholders(world.own.siteId, 1);
    const { eventId, agent, csrfToken } = await takenAlarm();
    await agent.post(`/api/monitoring/events/${eventId}/call-out`).set('x-csrf-token', csrfToken);
    await expect.poll(() => textsTo(first!).length).toBe(1);
    const url = `${publicUrl}/api/webhooks/twilio/inbound`;
    const params = { From: first!, Body: '1', MessageSid: `SM${'0'.repeat(32)}` };
    const post = (signature?: string) =>
      fetch(url, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/x-www-form-urlencoded',
          ...(signature ? { 'X-Twilio-Signature': signature } : {}),
        },
        body: new URLSearchParams(params),
      });

    const unsigned = await post();
    expect(unsigned.status).toBe(403);
    expect(unsigned.headers.get('content-type')).toMatch(/application\/problem\+json/);
    const forged = await post(twilio.getExpectedTwilioSignature('not-the-token', url, params));
    expect(forged.status).toBe(403);
    // Signed for another URL: a signature covers the address it was sent to.
    const elsewhere = await post(
      twilio.getExpectedTwilioSignature(authToken, `${url}?x=1`, params),
    );
    expect(elsewhere.status).toBe(403);
    expect((await db('alarm_events').where({ id: eventId }).first()).callout_status).toBe(
      'calling',
    );

    const status = await fetch(`${publicUrl}/api/webhooks/twilio/status?message=${eventId}`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ MessageSid: `SM${'0'.repeat(32)}`, MessageStatus: 'failed' }),
    });
    expect(status.status).toBe(403);

    // The genuine article, signed with the account's token, is taken.
    const genuine = await post(twilio.getExpectedTwilioSignature(authToken, url, params));
    expect(genuine.status).toBe(200);
    expect(await genuine.text()).toContain('<Response><Message>');
    expect((await db('alarm_events').where({ id: eventId }).first()).callout_status).toBe(
      'accepted',
    );
    await closeEvent(eventId);
  });

  it('answers a reply that is neither 1 nor 2 by asking again, and notes it', async () => {
    const [first] = await freshKeyholders(world.own.siteId, 1);
    const { eventId, agent, csrfToken } = await takenAlarm();
    await agent.post(`/api/monitoring/events/${eventId}/call-out`).set('x-csrf-token', csrfToken);
    await expect.poll(() => textsTo(first!).length).toBe(1);
    await fake.replyAs({ from: first!, body: 'who is this?' });
    await expect
      .poll(() => timelineOf(eventId))
      .toContain('Keyholder 1 replied "who is this?" (not 1 or 2).');
    expect((await db('alarm_events').where({ id: eventId }).first()).callout_status).toBe(
      'calling',
    );
    await closeEvent(eventId);
  });
});

describe('the outbox across a crash', () => {
  it('finds a text the provider took before the crash, and sends one it did not, once each', async () => {
    const [taken, lost] = await freshKeyholders(world.own.siteId, 2);
    const eventId = await alarmFromSite(db, world.own.siteId, 2);
    const longAgo = db.raw("now() - interval '10 minutes'");
    const [tookRow, lostRow] = await db('keyholder_messages')
      .insert(
        [
          { phone: taken!, reference: `T${randomBytes(3).toString('hex').toUpperCase()}` },
          { phone: lost!, reference: `L${randomBytes(3).toString('hex').toUpperCase()}` },
        ].map((message, index) => ({
          event_id: eventId,
          call_order: index + 1,
          keyholder_name: `Keyholder ${index + 1}`,
          phone: message.phone,
          reference: message.reference,
          body: `Test alert. Ref ${message.reference}`,
          status: 'sending',
          attempts: 1,
          claimed_at: longAgo,
        })),
      )
      .returning<{ id: string; reference: string }[]>(['id', 'reference']);
    // The first reached Twilio before the process died; the second never left.
    await createSmsSender({
      accountSid: LOCAL_TWILIO_ACCOUNT_SID,
      authToken,
      from: LOCAL_TWILIO_FROM,
      apiBaseUrl: fakeUrl,
    }).send({ to: taken!, body: `Test alert. Ref ${tookRow!.reference}` });

    await engine.drain();
    await expect
      .poll(async () =>
        db('keyholder_messages').whereIn('id', [tookRow!.id, lostRow!.id]).pluck('status'),
      )
      .not.toContain('sending');
    expect(textsTo(taken!)).toHaveLength(1);
    await expect.poll(() => textsTo(lost!).length).toBe(1);
    const rows = await db('keyholder_messages').whereIn('id', [tookRow!.id, lostRow!.id]);
    for (const row of rows) expect(row.provider_sid).toMatch(/^SM/);
    await db('alarm_events').where({ id: eventId }).update({ status: 'closed' });
  });
});

describe('police and phone calls', () => {
  it('refuses police for an unconfirmed intruder alarm, and allows it once confirmed with a URN', async () => {
    await db('sites')
      .where({ id: world.own.siteId })
      .update({ police_urn: 'EM/12345/26', urn_status: 'active' });
    const { eventId, agent, csrfToken } = await takenAlarm(1);
    const detail = await agent.get(`/api/monitoring/events/${eventId}`);
    expect(detail.body.police).toMatchObject({ eligible: false, urn: 'EM/12345/26' });
    const refused = await agent
      .post(`/api/monitoring/events/${eventId}/police`)
      .set('x-csrf-token', csrfToken)
      .send({ incidentReference: 'LOG 0412' });
    expect(refused.status).toBe(409);
    expect(refused.body.detail).toMatch(/confirmed alarms only/);

    // A second, different detector inside the window confirms it (BS 8243).
    await alarmFromSite(db, world.own.siteId, 2);
    const empty = await agent
      .post(`/api/monitoring/events/${eventId}/police`)
      .set('x-csrf-token', csrfToken)
      .send({ incidentReference: '  ' });
    expect(empty.status).toBe(400);
    const requested = await agent
      .post(`/api/monitoring/events/${eventId}/police`)
      .set('x-csrf-token', csrfToken)
      .send({ incidentReference: 'LOG 0412', note: 'Control room aware.' });
    expect(requested.status).toBe(200);
    expect(requested.body.police).toMatchObject({
      eligible: true,
      incidentReference: 'LOG 0412',
    });
    expect(await timelineOf(eventId)).toContain(
      'Police requested quoting URN EM/12345/26; incident reference LOG 0412. Control room aware.',
    );

    const call = await agent
      .post(`/api/monitoring/events/${eventId}/calls`)
      .set('x-csrf-token', csrfToken)
      .send({ position: 1, result: 'no_answer', note: 'Rang twice.' });
    expect(call.status).toBe(200);
    const other = await agent
      .post(`/api/monitoring/events/${eventId}/calls`)
      .set('x-csrf-token', csrfToken)
      .send({ position: null, who: '', result: 'other' });
    expect(other.status).toBe(400);
    expect(other.body.errors[0]).toMatchObject({ path: 'body.who' });
    expect(await timelineOf(eventId)).toContain('Called Keyholder 1: no answer. Rang twice.');
    await closeEvent(eventId);
    await db('sites')
      .where({ id: world.own.siteId })
      .update({ police_urn: null, urn_status: 'none' });
  });

  it('gives handling-time figures for the operator’s centre', async () => {
    const { agent } = await asOperator();
    const { body } = await agent.get('/api/monitoring/figures').expect(200);
    expect(body.last24Hours.events).toBeGreaterThan(0);
    expect(body.last24Hours.closed).toBeGreaterThan(0);
    expect(body.last24Hours.medianSecondsToTake).toBeGreaterThanOrEqual(0);
  });
});

describe('the keyholder in the app', () => {
  it('sees the alert they were texted about and answers it; others cannot', async () => {
    const [first] = await freshKeyholders(world.own.siteId, 2);
    const { eventId, agent, csrfToken } = await takenAlarm();
    await agent.post(`/api/monitoring/events/${eventId}/call-out`).set('x-csrf-token', csrfToken);
    await expect.poll(() => textsTo(first!).length).toBe(1);

    const keyholder = await harness.signedInAs(world.keyholder.userId);
    const alerts = await keyholder.agent.get('/api/my/alerts').expect(200);
    expect(alerts.body.active.map((alert: { eventId: string }) => alert.eventId)).toContain(
      eventId,
    );

    const stranger = await createPerson(db, { memberships: [{ role: 'keyholder' }] });
    const other = await harness.signedInAs(stranger.userId);
    const refused = await other.agent
      .post(`/api/my/alerts/${eventId}/response`)
      .set('x-csrf-token', other.csrfToken)
      .send({ response: 'attending' });
    expect(refused.status).toBe(404);
    expect((await other.agent.get('/api/my/alerts')).body.active).toEqual([]);

    const bad = await keyholder.agent
      .post(`/api/my/alerts/${eventId}/response`)
      .set('x-csrf-token', keyholder.csrfToken)
      .send({ response: 'maybe' });
    expect(bad.status).toBe(400);
    const answered = await keyholder.agent
      .post(`/api/my/alerts/${eventId}/response`)
      .set('x-csrf-token', keyholder.csrfToken)
      .send({ response: 'attending' });
    expect(answered.status).toBe(200);
    expect(answered.body).toMatchObject({ myResponse: 'attending', callOutStatus: 'accepted' });
    expect(await timelineOf(eventId)).toContain(
      'Keyholder 1 answered in the app: attending (about 10 minutes away).',
    );
    await closeEvent(eventId);
    const after = await keyholder.agent
      .post(`/api/my/alerts/${eventId}/response`)
      .set('x-csrf-token', keyholder.csrfToken)
      .send({ response: 'cannot_attend' });
    expect(after.status).toBe(409);
    const past = await keyholder.agent.get('/api/my/alerts');
    expect(past.body.past.map((alert: { eventId: string }) => alert.eventId)).toContain(eventId);
  });
});

describe('signal history and false alarms', () => {
  it('shows a homeowner their own home’s signals in words, and not another’s', async () => {
    await alarmFromSite(db, world.own.siteId, 2);
    const homeowner = await harness.signedInAs(world.homeowner.userId);
    const { body } = await homeowner.agent
      .get(`/api/my/homes/${world.own.siteId}/signals`)
      .expect(200);
    expect(body.signals[0]).toMatchObject({
      category: 'burglary',
      description: 'Intruder alarm',
      zone: 2,
      zoneName: 'Room 2',
    });
    expect(body.falseAlarms).toMatchObject({ standing: expect.any(String) });
    expect((await homeowner.agent.get(`/api/my/homes/${world.other.siteId}/signals`)).status).toBe(
      404,
    );
    expect(
      (await homeowner.agent.get(`/api/my/homes/${world.own.siteId}/signals?before=abc`)).status,
    ).toBe(400);
  });

  it('counts false alarms over 12 months for the installer, with the NPCC standing', async () => {
    const office = await harness.signedInAs(world.office.userId);
    const { body } = await office.agent
      .get(`/api/sites/${world.own.siteId}/false-alarms`)
      .expect(200);
    // Every event this file closed was closed as a user-error false alarm.
    expect(body.count).toBeGreaterThanOrEqual(3);
    expect(body.standing).toBe('withdrawal_due');
    expect(body.events[0]).toMatchObject({ outcome: 'false_alarm_user' });
    expect((await office.agent.get(`/api/sites/${world.other.siteId}/false-alarms`)).status).toBe(
      404,
    );
  });
});
