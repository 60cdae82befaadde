import { get } from 'node:http';
import type { AddressInfo } from 'node:net';
import { beforeAll, describe, expect, it } from 'vitest';
import { createPerson } from '../setup/factories';
import { alarmFromSite } from '../setup/monitoring-fixtures';
import { useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
let ownEvent: string;
let otherEvent: string;

beforeAll(async () => {
  world = currentWorld();
  ownEvent = await alarmFromSite(db, world.own.siteId, 2);
  otherEvent = await alarmFromSite(db, world.other.siteId, 2);
});

const asOperator = () => harness.signedInAs(world.operator.userId);

describe('the operator’s queue', () => {
  it('lists their centre’s events, never another centre’s', async () => {
    const { agent } = await asOperator();
    const { body } = await agent.get('/api/monitoring/events');
    const ids = body.events.map((event: { id: string }) => event.id);
    expect(ids).toContain(ownEvent);
    expect(ids).not.toContain(otherEvent);
    expect((await agent.get(`/api/monitoring/events/${otherEvent}`)).status).toBe(404);
  });

  it('orders hold-up before an intruder alarm', async () => {
    const site = await db('sites').where({ id: world.own.siteId }).first('monitoring_account');
    const { handleFrame } = await import('../../server/monitoring/receiver');
    const { simulatedFrame } = await import('../../server/monitoring/simulator');
    await handleFrame(
      { db },
      simulatedFrame({
        format: 'adm-cid',
        account: site.monitoring_account,
        code: '120',
        zone: 7,
        partition: 1,
        qualifier: 'new',
        sequence: 42,
        receiver: '1',
        linePrefix: '1',
      }),
    );
    const { agent } = await asOperator();
    const { body } = await agent.get('/api/monitoring/events');
    const mine = body.events.filter(
      (event: { siteId: string }) => event.siteId === world.own.siteId,
    );
    expect(mine.map((event: { category: string }) => event.category)).toEqual([
      'hold_up',
      'burglary',
    ]);
  });

  it('shows the site panel, the call plan and the timeline beside an event', async () => {
    const { agent } = await asOperator();
    const { body } = await agent.get(`/api/monitoring/events/${ownEvent}`);
    expect(body.event).toMatchObject({ id: ownEvent, category: 'burglary', zones: [2] });
    expect(body.site).toMatchObject({ address: expect.arrayContaining(['1 Test Street']) });
    expect(body.callPlan[0]).toMatchObject({ position: 1, name: 'Test Keyholder' });
    expect(body.timeline.map((entry: { kind: string }) => entry.kind)).toEqual(['received']);
  });

  it('locks a taken event to one operator, and only they close it, with an outcome', async () => {
    const colleague = await createPerson(db, {
      memberships: [{ role: 'operator', organisationId: world.centre.id }],
    });
    const other = await harness.signedInAs(colleague.userId);
    const closeEarly = await other.agent
      .post(`/api/monitoring/events/${ownEvent}/close`)
      .set('x-csrf-token', other.csrfToken)
      .send({ outcome: 'false_alarm_user' });
    expect(closeEarly.status).toBe(409);

    const { agent, csrfToken } = await asOperator();
    const taken = await agent
      .post(`/api/monitoring/events/${ownEvent}/take`)
      .set('x-csrf-token', csrfToken);
    expect(taken.body.event).toMatchObject({
      status: 'taken',
      takenBy: world.operator.displayName,
    });
    const snatch = await other.agent
      .post(`/api/monitoring/events/${ownEvent}/take`)
      .set('x-csrf-token', other.csrfToken);
    expect(snatch.status).toBe(409);
    expect(snatch.body.detail).toContain(world.operator.displayName);

    const bad = await agent
      .post(`/api/monitoring/events/${ownEvent}/close`)
      .set('x-csrf-token', csrfToken)
      .send({ outcome: 'whatever' });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('body.outcome');
    const closed = await agent
      .post(`/api/monitoring/events/${ownEvent}/close`)
      .set('x-csrf-token', csrfToken)
      .send({ outcome: 'false_alarm_user', note: 'Homeowner set it off; password given.' });
    expect(closed.body.event).toMatchObject({ status: 'closed', outcome: 'false_alarm_user' });
    expect(closed.body.timeline.map((entry: { kind: string }) => entry.kind)).toEqual([
      'received',
      'taken',
      'closed',
    ]);
    const active = await agent.get('/api/monitoring/events');
    expect(active.body.events.map((event: { id: string }) => event.id)).not.toContain(ownEvent);
    const done = await agent.get('/api/monitoring/events?status=closed');
    expect(done.body.events.map((event: { id: string }) => event.id)).toContain(ownEvent);
    // The false alarm now counts against the site's police response (NPCC policy).
    expect(closed.body.falseAlarms).toMatchObject({ count: 1, standing: 'in_good_standing' });
  });
});

describe('the live stream', () => {
  it('tells an operator of their centre’s changes within moments, and nothing of others', async () => {
    const server = harness.app.listen(0);
    const { port } = server.address() as AddressInfo;
    const { cookie } = await asOperator();
    const received: string[] = [];
    let ready: () => void;
    const isReady = new Promise<void>((resolve) => (ready = resolve));
    const request = get(
      { host: '127.0.0.1', port, path: '/api/monitoring/stream', headers: { cookie } },
      (response) => {
        expect(response.headers['content-type']).toContain('text/event-stream');
        response.setEncoding('utf8');
        response.on('data', (chunk: string) => {
          received.push(chunk);
          if (chunk.includes('event: ready')) ready();
        });
      },
    );
    await isReady;
    const theirs = await alarmFromSite(db, world.other.siteId, 8);
    const mine = await alarmFromSite(db, world.own.siteId, 9);
    await expect.poll(() => received.join(''), { timeout: 5_000 }).toContain(mine);
    expect(received.join('')).not.toContain(theirs);
    request.destroy();
    await new Promise((resolve) => server.close(resolve));
  });
});
