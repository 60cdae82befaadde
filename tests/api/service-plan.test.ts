import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { addCalendarMonths } from '../../server/calc/service-plan';
import { createPerson, type TestPerson } from '../setup/factories';
import { issuePackThroughApi } from '../setup/handover-fixtures';
import { createSiteRecord, useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

// The plan's rule: "2 preventive visits a year for remotely monitored systems, 1 for
// audible-only (from memory of PD 6662 / BS 9263 practice)", ../shared/checks.md.
const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
/** An audible-only site of the same installer: no monitoring centre. */
let audibleSiteId: string;
let audibleSystemId: string;
/** People of the rival installer that owns world.other. */
let rivalOffice: TestPerson;
let rivalEngineer: TestPerson;
let secondEngineer: TestPerson;

beforeAll(async () => {
  world = currentWorld();
  const audible = await createSiteRecord(db, {
    installerId: world.installer.id,
    homeownerId: world.homeowner.userId,
  });
  audibleSiteId = audible.siteId;
  audibleSystemId = audible.systemId;
  const rival = await db('sites').where({ id: world.other.siteId }).first('installer_id');
  [rivalOffice, rivalEngineer, secondEngineer] = await Promise.all([
    createPerson(db, { memberships: [{ role: 'office', organisationId: rival.installer_id }] }),
    createPerson(db, { memberships: [{ role: 'engineer', organisationId: rival.installer_id }] }),
    createPerson(db, {
      memberships: [{ role: 'engineer', organisationId: world.installer.id }],
      name: 'Second Engineer',
    }),
  ]);
});

const as = (person: TestPerson) => harness.signedInAs(person.userId);
const planOf = async (person: TestPerson, siteId: string) =>
  (await as(person)).agent.get(`/api/sites/${siteId}/service-plan`);

async function book(person: TestPerson, siteId: string, body: Record<string, unknown>) {
  const { agent, csrfToken } = await as(person);
  return agent
    .post(`/api/sites/${siteId}/service/visits`)
    .set('x-csrf-token', csrfToken)
    .send(body);
}

async function move(person: TestPerson, visitId: string, body: Record<string, unknown>) {
  const { agent, csrfToken } = await as(person);
  return agent.patch(`/api/service/visits/${visitId}`).set('x-csrf-token', csrfToken).send(body);
}

/** A preventive visit recorded as done on the day given (midday UK time). */
async function doneVisit(siteId: string, on: string, planVisitsPerYear: number | null) {
  await db('service_visits').insert({
    site_id: siteId,
    kind: 'preventive',
    status: 'done',
    due_date: on,
    completed_at: `${on}T12:00:00+00:00`,
    plan_visits_per_year: planVisitsPerYear,
  });
}

const tomorrowAt = (hour: number) => {
  const date = new Date(Date.now() + 36 * 3_600_000);
  date.setUTCHours(hour, 0, 0, 0);
  return date.toISOString();
};

describe('the service plan follows the signalling', () => {
  it('plans two visits a year for a site linked to a monitoring centre', async () => {
    const response = await planOf(world.office, world.own.siteId);
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({
      signalling: 'remotely_monitored',
      visitsPerYear: 2,
      intervalMonths: 6,
      rule: '2 preventive visits a year for remotely monitored systems, 1 for audible-only',
      source: 'from memory of PD 6662 / BS 9263 practice',
    });
  });

  it('plans one a year for an audible-only site, also with a path that is not to a centre', async () => {
    await db('signalling_paths').insert({
      system_id: audibleSystemId,
      position: 1,
      bearer: 'cellular',
      description: 'Speech dialler to the homeowner',
      to_monitoring_centre: false,
    });
    const response = await planOf(world.engineer, audibleSiteId);
    expect(response.body).toMatchObject({
      signalling: 'audible_only',
      visitsPerYear: 1,
      intervalMonths: 12,
      signallingReason: expect.stringMatching(/No signalling path goes to a monitoring centre/),
    });
  });

  it('counts an audible-only site from its last visit and flags it overdue a year on', async () => {
    await doneVisit(audibleSiteId, '2020-03-10', 1);
    const response = await planOf(world.homeowner, audibleSiteId);
    expect(response.body).toMatchObject({
      countsFrom: 'last_preventive_visit',
      lastPreventiveVisitOn: '2020-03-10',
      nextDueOn: '2021-03-10',
      overdue: true,
      planChange: null,
    });
    expect(response.body.daysOverdue).toBeGreaterThan(0);
  });

  it('moves the due date when a path to a monitoring centre is added, and says so', async () => {
    await db('signalling_paths').insert({
      system_id: audibleSystemId,
      position: 2,
      bearer: 'ip',
      description: 'Added later',
      to_monitoring_centre: true,
    });
    const response = await planOf(world.office, audibleSiteId);
    expect(response.body).toMatchObject({
      signalling: 'remotely_monitored',
      signallingReason: expect.stringMatching(/check the site record/),
      visitsPerYear: 2,
      nextDueOn: '2020-09-10',
      overdue: true,
      planChange: { fromVisitsPerYear: 1, toVisitsPerYear: 2 },
    });
    await db('signalling_paths').where({ system_id: audibleSystemId, position: 2 }).delete();
  });

  it('starts the plan at handover, from the pack actually issued', async () => {
    await issuePackThroughApi(harness, db, world.own.siteId);
    const { body } = await planOf(world.homeowner, world.own.siteId);
    expect(body).toMatchObject({
      inServiceBasis: 'handover',
      inServiceSince: body.today,
      countsFrom: 'in_service',
      nextDueOn: addCalendarMonths(body.today, 6),
      overdue: false,
      planChange: null,
    });
  });

  it('shows the plan to the homeowner but not to the operator, keyholder or anyone else', async () => {
    expect((await planOf(world.homeowner, world.own.siteId)).status).toBe(200);
    expect((await planOf(world.operator, world.own.siteId)).status).toBe(403);
    expect((await planOf(world.keyholder, world.own.siteId)).status).toBe(403);
    expect((await planOf(world.otherHomeowner, world.own.siteId)).status).toBe(404);
    expect((await planOf(rivalEngineer, world.own.siteId)).status).toBe(404);
  });
});

describe('booking visits', () => {
  let visitId: string;

  it('books the next preventive visit on the plan due date, with an engineer', async () => {
    const plan = (await planOf(world.office, world.own.siteId)).body;
    const clientKey = randomUUID();
    const scheduledFor = tomorrowAt(9);
    const response = await book(world.office, world.own.siteId, {
      kind: 'preventive',
      scheduledFor,
      engineerId: world.engineer.userId,
      clientKey,
    });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      siteId: world.own.siteId,
      kind: 'preventive',
      status: 'scheduled',
      dueDate: plan.nextDueOn,
      scheduledFor,
      engineer: { id: world.engineer.userId, name: world.engineer.displayName },
      planVisitsPerYear: 2,
      version: 1,
    });
    visitId = response.body.id;

    // The same booking sent again (a double click, a dropped connection) books once.
    const again = await book(world.office, world.own.siteId, {
      kind: 'preventive',
      scheduledFor,
      engineerId: world.engineer.userId,
      clientKey,
    });
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(visitId);
    expect(await db('service_visits').where({ site_id: world.own.siteId }).count('* as n')).toEqual(
      [{ n: 1 }],
    );
    const audit = await db('audit_log').where({ entity_id: visitId }).pluck('action');
    expect(audit).toEqual(['service_visit.scheduled']);

    const planNow = (await planOf(world.homeowner, world.own.siteId)).body;
    expect(planNow.bookedVisit).toMatchObject({
      id: visitId,
      engineerName: world.engineer.displayName,
    });
  });

  it('refuses a second preventive visit while one is booked', async () => {
    const response = await book(world.office, world.own.siteId, { kind: 'preventive' });
    expect(response.status).toBe(409);
    expect(response.headers['content-type']).toContain('application/problem+json');
    expect(response.body.detail).toMatch(/already booked/);
  });

  it('books a call-out with the fault reported, due today by default', async () => {
    const response = await book(world.office, world.own.siteId, {
      kind: 'corrective',
      reportedFault: 'Keypad shows a tamper on the hall detector.',
    });
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      kind: 'corrective',
      reportedFault: 'Keypad shows a tamper on the hall detector.',
      planVisitsPerYear: null,
      engineer: null,
    });
  });

  it('shows the schedule to the company, filtered by engineer, and to nobody else', async () => {
    const day = tomorrowAt(9).slice(0, 10);
    const query = `/api/service/visits?from=${day}&to=${day}`;
    const engineerView = await (await as(world.engineer)).agent.get(query);
    expect(engineerView.status).toBe(200);
    expect(engineerView.body.visits.map((visit: { id: string }) => visit.id)).toContain(visitId);
    const filtered = await (
      await as(world.office)
    ).agent.get(`${query}&engineerId=${secondEngineer.userId}`);
    expect(filtered.body.visits).toEqual([]);
    const rivalView = await (await as(rivalOffice)).agent.get(query);
    expect(rivalView.body.visits).toEqual([]);
    expect((await (await as(world.homeowner)).agent.get(query)).status).toBe(403);
  });

  it('reassigns and moves a visit at the version seen, and refuses a stale version', async () => {
    const later = tomorrowAt(14);
    const moved = await move(world.office, visitId, {
      version: 1,
      engineerId: secondEngineer.userId,
      scheduledFor: later,
    });
    expect(moved.status).toBe(200);
    expect(moved.body).toMatchObject({
      scheduledFor: later,
      engineer: { id: secondEngineer.userId },
      version: 2,
    });

    const stale = await move(world.office, visitId, { version: 1, engineerId: null });
    expect(stale.status).toBe(409);
    expect(stale.headers['content-type']).toContain('application/problem+json');
    expect(stale.body.detail).toMatch(/Reload/);
    const stored = await db('service_visits').where({ id: visitId }).first();
    expect(stored).toMatchObject({ engineer_id: secondEngineer.userId, version: 2 });

    const audit = await db('audit_log')
      .where({ entity_id: visitId, action: 'service_visit.updated' })
      .first('changes');
    expect(Object.keys(audit.changes)).toEqual(
      expect.arrayContaining(['engineer_id', 'scheduled_for']),
    );
  });

  it('cancels a visit, then books it again', async () => {
    const cancelled = await move(world.office, visitId, { version: 2, status: 'cancelled' });
    expect(cancelled.body).toMatchObject({ status: 'cancelled', version: 3 });
    const movedWhileCancelled = await move(world.office, visitId, {
      version: 3,
      scheduledFor: tomorrowAt(10),
    });
    expect(movedWhileCancelled.status).toBe(409);
    const rebooked = await move(world.office, visitId, { version: 3, status: 'scheduled' });
    expect(rebooked.body).toMatchObject({ status: 'scheduled', version: 4 });
    expect(
      await db('audit_log').where({ entity_id: visitId }).orderBy('id').pluck('action'),
    ).toEqual([
      'service_visit.scheduled',
      'service_visit.updated',
      'service_visit.cancelled',
      'service_visit.updated',
    ]);
  });

  it('will not move a visit that is done', async () => {
    const [done] = await db('service_visits')
      .insert({
        site_id: audibleSiteId,
        kind: 'corrective',
        status: 'done',
        due_date: '2026-01-05',
        completed_at: '2026-01-05T15:00:00Z',
      })
      .returning('id');
    const response = await move(world.office, done.id, { version: 1, dueDate: '2026-01-06' });
    expect(response.status).toBe(409);
    expect(response.body.detail).toMatch(/done/);
  });
});

describe('another installer', () => {
  it('cannot book, move or assign on this site: not even told it exists', async () => {
    expect((await book(rivalOffice, world.own.siteId, { kind: 'preventive' })).status).toBe(404);
    const visit = await db('service_visits')
      .where({ site_id: world.own.siteId, kind: 'preventive', status: 'scheduled' })
      .first('id', 'version');
    const response = await move(rivalOffice, visit.id, {
      version: visit.version,
      engineerId: rivalEngineer.userId,
    });
    expect(response.status).toBe(404);
    expect((await move(rivalEngineer, visit.id, { version: visit.version })).status).toBe(403);
    const stored = await db('service_visits').where({ id: visit.id }).first('engineer_id');
    expect(stored.engineer_id).not.toBe(rivalEngineer.userId);
  });

  it('cannot have its engineer sent by this office', async () => {
    const visit = await db('service_visits')
      .where({ site_id: world.own.siteId, kind: 'preventive', status: 'scheduled' })
      .first('id', 'version');
    const response = await move(world.office, visit.id, {
      version: visit.version,
      engineerId: rivalEngineer.userId,
    });
    expect(response.status).toBe(400);
    expect(response.body.errors).toEqual([
      { path: 'body.engineerId', message: 'Choose an engineer of your own company.' },
    ]);
    const booking = await book(world.office, audibleSiteId, {
      kind: 'corrective',
      reportedFault: 'Bell box light flashing.',
      engineerId: rivalEngineer.userId,
    });
    expect(booking.status).toBe(400);
  });
});

describe('bad dates', () => {
  const callOut = (fields: Record<string, unknown>) =>
    book(world.office, audibleSiteId, {
      kind: 'corrective',
      reportedFault: 'Sounder will not stop.',
      ...fields,
    });

  it('refuses impossible, past and far-off dates, naming the field', async () => {
    const impossible = await callOut({ dueDate: '2027-02-30' });
    expect(impossible.status).toBe(400);
    expect(impossible.headers['content-type']).toContain('application/problem+json');
    expect(impossible.body.errors[0]).toMatchObject({
      path: 'body.dueDate',
      message: 'Enter a date as YYYY-MM-DD.',
    });

    const past = await callOut({ scheduledFor: '2020-01-01T09:00:00Z' });
    expect(past.status).toBe(400);
    expect(past.body.errors[0]).toMatchObject({ path: 'body.scheduledFor' });

    const farOff = await callOut({ dueDate: '2207-01-01' });
    expect(farOff.status).toBe(400);
    expect(farOff.body.errors[0].message).toMatch(/check the year/);

    const dateOnly = await callOut({ scheduledFor: '2030-01-01' });
    expect(dateOnly.status).toBe(400);
    expect(dateOnly.body.errors[0].path).toBe('body.scheduledFor');

    const noFault = await book(world.office, audibleSiteId, { kind: 'corrective' });
    expect(noFault.body.errors[0].path).toBe('body.reportedFault');
    // Nothing was saved by any of them.
    expect(
      await db('service_visits')
        .where({ site_id: audibleSiteId, reported_fault: 'Sounder will not stop.' })
        .count('* as n'),
    ).toEqual([{ n: 0 }]);
  });

  it('refuses a schedule that ends before it starts or spans more than a quarter', async () => {
    const { agent } = await as(world.office);
    const backwards = await agent.get('/api/service/visits?from=2027-03-01&to=2027-02-01');
    expect(backwards.status).toBe(400);
    expect(backwards.body.errors[0].path).toBe('query.to');
    const tooLong = await agent.get('/api/service/visits?from=2027-01-01&to=2027-12-31');
    expect(tooLong.status).toBe(400);
    const garbled = await agent.get('/api/service/visits?from=next-week');
    expect(garbled.status).toBe(400);
    expect(garbled.body.errors[0].path).toBe('query.from');
  });
});

describe('the overdue list', () => {
  it('lists the company sites whose preventive visit is past due, and no one else', async () => {
    const { agent } = await as(world.office);
    const response = await agent.get('/api/service/overdue');
    expect(response.status).toBe(200);
    const ids = response.body.sites.map((site: { siteId: string }) => site.siteId);
    expect(ids).toContain(audibleSiteId);
    // Handed over today: not due for six months.
    expect(ids).not.toContain(world.own.siteId);
    expect(
      response.body.sites.find((site: { siteId: string }) => site.siteId === audibleSiteId),
    ).toMatchObject({ nextDueOn: '2021-03-10', lastPreventiveVisitOn: '2020-03-10' });

    // The rival company's overdue site is not in this list.
    await doneVisit(world.other.siteId, '2019-05-01', 2);
    const again = await agent.get('/api/service/overdue');
    expect(again.body.sites.map((site: { siteId: string }) => site.siteId)).not.toContain(
      world.other.siteId,
    );
    const rival = await (await as(rivalOffice)).agent.get('/api/service/overdue');
    expect(rival.body.sites.map((site: { siteId: string }) => site.siteId)).toEqual([
      world.other.siteId,
    ]);
    expect((await (await as(world.engineer)).agent.get('/api/service/overdue')).status).toBe(403);
  });
});
