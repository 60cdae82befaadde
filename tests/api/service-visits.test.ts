import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { addCalendarMonths } from '../../server/calc/service-plan';
import { ukDateOf } from '../../server/service/service';
import { createPerson, type TestPerson } from '../setup/factories';
import { signaturePng } from '../setup/signature-png';
import {
  createSiteRecord,
  useSiteWorld,
  type SiteFixture,
  type SiteWorld,
} from '../setup/site-fixtures';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
let rivalEngineer: TestPerson;
let pathId: string;

/** Makes the fixture's system one the calculations can judge: supply, battery and currents. */
async function powerUp(site: SiteFixture) {
  await db('systems').where({ id: site.systemId }).update({
    psu_type: 'A',
    battery_ah: 7,
    panel_quiescent_ma: 110,
    panel_alarm_ma: 160,
  });
  await db('zones').where({ system_id: site.systemId }).update({ quiescent_ma: 15, alarm_ma: 25 });
}

beforeAll(async () => {
  world = currentWorld();
  await powerUp(world.own);
  const [path] = await db('signalling_paths')
    .insert({
      system_id: world.own.systemId,
      position: 1,
      bearer: 'ip',
      description: 'Primary path to the centre',
      to_monitoring_centre: true,
    })
    .returning<{ id: string }[]>('id');
  pathId = path!.id;
  const rival = await db('sites').where({ id: world.other.siteId }).first('installer_id');
  rivalEngineer = await createPerson(db, {
    memberships: [{ role: 'engineer', organisationId: rival.installer_id }],
  });
});

const as = (person: TestPerson) => harness.signedInAs(person.userId);

async function complete(person: TestPerson, visitId: string, body: Record<string, unknown>) {
  const { agent, csrfToken } = await as(person);
  return agent
    .post(`/api/service/visits/${visitId}/complete`)
    .set('x-csrf-token', csrfToken)
    .send(body);
}

/** A preventive visit booked for the site, as the office books it. */
async function bookedPreventive(siteId: string) {
  const { agent, csrfToken } = await as(world.office);
  const response = await agent
    .post(`/api/sites/${siteId}/service/visits`)
    .set('x-csrf-token', csrfToken)
    .send({ kind: 'preventive', engineerId: world.engineer.userId });
  expect(response.status).toBe(201);
  return response.body.id as string;
}

/** Midday UK time, some days ago: a finished visit's time that no clock skew reaches. */
const daysAgo = (days: number) => {
  const at = new Date(Date.now() - days * 86_400_000);
  at.setUTCHours(11, 30, 0, 0);
  return at.toISOString();
};

/** The form as an engineer sends it after a visit where everything was tested and worked. */
function fullForm(site: SiteFixture, overrides: Record<string, unknown> = {}) {
  return {
    kind: 'preventive',
    clientKey: randomUUID(),
    completedAt: daysAgo(1),
    battery: { restingVolts: 13.1, loadTestVolts: 12.4, loadTestAmps: 1.5 },
    zones: [
      { zoneId: site.zoneIds[0], secureReading: '2k2', alarmReading: '6k9', activated: true },
      { zoneId: site.zoneIds[1], secureReading: 2200, alarmReading: '6.9 kΩ', activated: true },
    ],
    tampers: { result: 'passed' },
    sounders: { internal: { result: 'passed' }, external: { result: 'passed' } },
    signalling: site === world.own ? [{ pathId, result: 'passed', centreReference: 'T-1' }] : [],
    userTrainingGiven: true,
    userConfidence: 'confident',
    ...overrides,
  };
}

const fieldPaths = (body: { errors?: { path: string }[] }) =>
  (body.errors ?? []).map((error) => error.path);

describe('completing a preventive visit', () => {
  let visitId: string;

  it('records real readings, classifies them and counts the next visit from this one', async () => {
    visitId = await bookedPreventive(world.own.siteId);
    const form = fullForm(world.own);
    const response = await complete(world.engineer, visitId, form);
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body).toMatchObject({
      id: visitId,
      kind: 'preventive',
      status: 'done',
      completedAt: form.completedAt,
      engineer: { id: world.engineer.userId },
      planVisitsPerYear: 2,
      outcome: { passed: true, words: 'Every check passed.', findings: [] },
      customerSignedBy: null,
    });
    // Two-resistor loop, 2k2 tamper and 4k7 alarm: 2.2 kΩ secure, 2.2 + 4.7 = 6.9 kΩ in alarm
    // (common practice, no source; ../shared/checks.md).
    const zones = response.body.preventive.zones;
    expect(zones).toHaveLength(2);
    for (const zone of zones)
      expect(zone).toMatchObject({
        secureReadingOhms: 2200,
        secureState: 'normal',
        alarmReadingOhms: 6900,
        alarmState: 'alarm',
        passed: true,
        failures: [],
      });
    // Power budget: (0.14 A × 12 h + 0.21 A × 0.25 h) × 1.25 = 2.17 Ah, 12 h standby for grade 2
    // on a type A supply (EN 50131-6, from memory; ../shared/checks.md), so 7 Ah covers it.
    expect(response.body.preventive.battery).toMatchObject({
      restingVolts: 13.1,
      passed: true,
      reasons: [],
      notes: [
        'The fitted 7 Ah covers the power budget: (0.14 A × 12 h + 0.21 A × 0.25 h) × 1.25 = 2.17 Ah.',
      ],
    });
    expect(response.body.preventive).toMatchObject({
      signalling: [{ pathId, position: 1, bearer: 'ip', result: 'passed', centreReference: 'T-1' }],
      userTrainingGiven: true,
      userConfidence: { score: 4, words: 'confident' },
      notTested: [],
    });
    // Monitored: two visits a year (from memory of PD 6662 / BS 9263 practice), so six months on.
    expect(response.body.nextDueOn).toBe(
      addCalendarMonths(ukDateOf(new Date(form.completedAt)), 6),
    );
    const plan = await (
      await as(world.office)
    ).agent.get(`/api/sites/${world.own.siteId}/service-plan`);
    expect(plan.body).toMatchObject({
      countsFrom: 'last_preventive_visit',
      lastPreventiveVisitOn: ukDateOf(new Date(form.completedAt)),
      nextDueOn: response.body.nextDueOn,
      bookedVisit: null,
    });
    const stored = await db('service_visits').where({ id: visitId }).first();
    expect(stored.checklist.zones[0].secureState).toBe('normal');
    const audit = await db('audit_log').where({ entity_id: visitId }).pluck('action');
    expect(audit).toEqual(['service_visit.scheduled', 'service_visit.completed']);
  });

  it('shows the done visit in the homeowner’s service history, newest first', async () => {
    const { agent } = await as(world.homeowner);
    const response = await agent.get(`/api/my/homes/${world.own.siteId}/service-history`);
    expect(response.status).toBe(200);
    expect(response.body.entries[0]).toMatchObject({
      kind: 'visit',
      id: visitId,
      visitKind: 'preventive',
      title: 'Preventive visit done',
      outcome: 'Every check passed.',
      passed: true,
      engineerName: world.engineer.displayName,
    });
  });

  it('answers a resend with the same record, and records the visit once', async () => {
    const siteId = world.own.siteId;
    const again = await bookedPreventive(siteId);
    const form = fullForm(world.own);
    const [first, second] = await Promise.all([
      complete(world.engineer, again, form),
      complete(world.engineer, again, form),
    ]);
    const third = await complete(world.engineer, again, form);
    for (const response of [first, second, third]) {
      expect(response.status, JSON.stringify(response.body)).toBe(200);
      expect(response.body).toMatchObject({ id: again, status: 'done', version: 2 });
    }
    const audit = await db('audit_log')
      .where({ entity_id: again, action: 'service_visit.completed' })
      .count('* as n');
    expect(audit).toEqual([{ n: 1 }]);
    // Another form for a visit already done is refused: it is not changed after the fact.
    const other = await complete(world.engineer, again, fullForm(world.own));
    expect(other.status).toBe(409);
    expect(other.headers['content-type']).toMatch(/application\/problem\+json/);
  });

  it('classifies a zone reading out of tolerance, or a short, as a fault found', async () => {
    const site = await createSiteRecord(db, {
      installerId: world.installer.id,
      homeownerId: world.homeowner.userId,
    });
    await powerUp(site);
    const visit = await bookedPreventive(site.siteId);
    const response = await complete(
      world.engineer,
      visit,
      fullForm(site, {
        zones: [
          // 5 kΩ lies between the normal (2.09–2.34 kΩ) and alarm (6.56–7.28 kΩ) bands of a
          // 2k2/4k7 loop at ±5 % with up to 30 Ω of cable (common practice, no source).
          { zoneId: site.zoneIds[0], secureReading: '5k0', activated: true },
          { zoneId: site.zoneIds[1], secureReading: '0R5', activated: true },
        ],
      }),
    );
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body.status).toBe('done');
    expect(response.body.preventive.zones).toMatchObject([
      { number: 1, secureReadingOhms: 5000, secureState: 'out_of_tolerance', passed: false },
      { number: 2, secureReadingOhms: 0.5, secureState: 'short_circuit', passed: false },
    ]);
    expect(response.body.outcome).toMatchObject({
      passed: false,
      words: '2 findings to put right.',
    });
    expect(response.body.outcome.findings[0]).toMatch(
      /^Zone 1 \(Room 1\): The secure reading \(5 kΩ\) is out of tolerance/,
    );
    expect(response.body.outcome.findings[1]).toMatch(/^Zone 2 \(Room 2\): .*short circuit/);
  });

  it('refuses a visit dated in the future, naming the field, and saves nothing', async () => {
    const site = await createSiteRecord(db, { installerId: world.installer.id });
    const visit = await bookedPreventive(site.siteId);
    const inAnHour = new Date(Date.now() + 3_600_000).toISOString();
    const response = await complete(
      world.engineer,
      visit,
      fullForm(site, { completedAt: inAnHour }),
    );
    expect(response.status).toBe(400);
    expect(response.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(fieldPaths(response.body)).toEqual(['body.completedAt']);
    expect(response.body.errors[0].message).toMatch(/future/);
    expect(await db('service_visits').where({ id: visit }).first('status')).toEqual({
      status: 'scheduled',
    });
  });

  it('refuses readings out of physical range, naming each field', async () => {
    const site = await createSiteRecord(db, { installerId: world.installer.id });
    const visit = await bookedPreventive(site.siteId);
    const response = await complete(
      world.engineer,
      visit,
      fullForm(site, {
        battery: { restingVolts: 45, loadTestVolts: -1, loadTestAmps: 0 },
        zones: [
          { zoneId: site.zoneIds[0], secureReading: '-220', activated: true },
          { zoneId: site.zoneIds[1], secureReading: '500M', activated: true },
        ],
        userConfidence: 7,
      }),
    );
    expect(response.status).toBe(400);
    expect(fieldPaths(response.body).sort()).toEqual(
      [
        'body.battery.restingVolts',
        'body.battery.loadTestVolts',
        'body.battery.loadTestAmps',
        'body.zones.0.secureReading',
        'body.zones.1.secureReading',
        'body.userConfidence',
      ].sort(),
    );
    expect(await db('service_visits').where({ id: visit }).first('status')).toEqual({
      status: 'scheduled',
    });
  });

  it('refuses a visit that leaves a zone untested unless the customer signs for it', async () => {
    const site = await createSiteRecord(db, { installerId: world.installer.id });
    const visit = await bookedPreventive(site.siteId);
    const oneZone = [{ zoneId: site.zoneIds[0], secureReading: '2k2', activated: true }];

    const untested = await complete(world.engineer, visit, fullForm(site, { zones: oneZone }));
    expect(untested.status).toBe(400);
    expect(untested.body.errors).toEqual([
      {
        path: 'body.zones',
        message:
          'Zone 2 (Room 2) has no walk test: test it, or list it as not tested with the reason.',
      },
    ]);

    const notTested = [
      { item: 'zone', zoneId: site.zoneIds[1], reason: 'The room was locked.' },
      { item: 'external_sounders', reason: 'Scaffolding in the way.' },
    ];
    /** Zone 2 and the external sounder left untested, with whatever signature is given. */
    const leavingTwoUntested = (signature: Record<string, string>) =>
      complete(
        world.engineer,
        visit,
        fullForm(site, {
          zones: oneZone,
          sounders: { internal: { result: 'passed' }, external: null },
          notTested,
          ...signature,
        }),
      );
    const unsigned = await leavingTwoUntested({});
    expect(unsigned.status).toBe(400);
    expect(fieldPaths(unsigned.body).sort()).toEqual([
      'body.customerName',
      'body.customerSignature',
    ]);

    const notAPng = await leavingTwoUntested({
      customerName: 'Ada Customer',
      customerSignature: `data:image/png;base64,${Buffer.from('not a picture at all, only text that is long enough to pass').toString('base64')}`,
    });
    expect(notAPng.status).toBe(400);
    expect(fieldPaths(notAPng.body)).toEqual(['body.customerSignature']);

    const signed = await leavingTwoUntested({
      customerName: 'Ada Customer',
      customerSignature: signaturePng(3),
    });
    expect(signed.status, JSON.stringify(signed.body)).toBe(200);
    expect(signed.body).toMatchObject({
      customerSignedBy: 'Ada Customer',
      outcome: {
        passed: true,
        words: 'Everything tested passed. 2 items not tested, signed for by Ada Customer.',
      },
    });
    expect(signed.body.preventive.notTested).toEqual([
      {
        item: 'zone',
        zoneId: site.zoneIds[1],
        pathId: null,
        label: 'Zone 2 (Room 2)',
        reason: 'The room was locked.',
      },
      {
        item: 'external_sounders',
        zoneId: null,
        pathId: null,
        label: 'External sounders',
        reason: 'Scaffolding in the way.',
      },
    ]);
    const stored = await db('service_visits').where({ id: visit }).first('customer_signature');
    expect(stored.customer_signature).toBe(signaturePng(3));
  });

  it('keeps visits to the engineers of the site’s installer', async () => {
    const visit = await bookedPreventive(
      (await createSiteRecord(db, { installerId: world.installer.id })).siteId,
    );
    const form = fullForm(world.own);
    expect((await complete(rivalEngineer, visit, form)).status).toBe(404);
    expect((await complete(world.office, visit, form)).status).toBe(403);
    expect((await complete(world.homeowner, visit, form)).status).toBe(403);
    expect((await complete(world.engineer, randomUUID(), form)).status).toBe(404);
  });
});

describe('call-outs', () => {
  let site: SiteFixture;
  let visitId: string;

  beforeAll(async () => {
    site = await createSiteRecord(db, {
      installerId: world.installer.id,
      monitoringCentreId: world.centre.id,
      homeownerId: world.homeowner.userId,
    });
    await db('sites').where({ id: site.siteId }).update({
      police_urn: 'EM/2026/123',
      urn_status: 'withdrawn',
    });
    // A false alarm the centre closed ten days ago (an invented event).
    const at = new Date(Date.now() - 10 * 86_400_000);
    await db('alarm_events').insert({
      site_id: site.siteId,
      account: 'CALLOUT1',
      category: 'burglary',
      priority: 3,
      status: 'closed',
      outcome: 'false_alarm_environment',
      first_signal_at: at,
      last_signal_at: at,
      closed_at: at,
    });
  });

  it('lets an engineer book one from a phone call', async () => {
    const { agent, csrfToken } = await as(world.engineer);
    const clientKey = randomUUID();
    const send = () =>
      agent
        .post(`/api/sites/${site.siteId}/service/callouts`)
        .set('x-csrf-token', csrfToken)
        .send({ reportedFault: 'Alarm went off at 3 am with nobody home.', clientKey });
    const response = await send();
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    expect(response.body).toMatchObject({
      kind: 'corrective',
      status: 'scheduled',
      reportedFault: 'Alarm went off at 3 am with nobody home.',
      faultReportId: null,
    });
    visitId = response.body.id;
    expect((await send()).body.id).toBe(visitId);
    const missing = await agent
      .post(`/api/sites/${site.siteId}/service/callouts`)
      .set('x-csrf-token', csrfToken)
      .send({});
    expect(missing.status).toBe(400);
    expect(fieldPaths(missing.body)).toEqual(['body.reportedFault']);
  });

  it('refuses the preventive form for a call-out, and a false alarm without its cause', async () => {
    const wrongForm = await complete(world.engineer, visitId, fullForm(site));
    expect(wrongForm.status).toBe(400);
    expect(fieldPaths(wrongForm.body)).toEqual(['body.kind']);
    const noCause = await complete(world.engineer, visitId, {
      kind: 'corrective',
      clientKey: randomUUID(),
      completedAt: daysAgo(0),
      primeCause: 'environment',
      actionTaken: 'Cleaned the detector.',
      falseAlarm: true,
    });
    expect(noCause.status).toBe(400);
    expect(fieldPaths(noCause.body)).toEqual(['body.falseAlarmCause']);
    const badCause = await complete(world.engineer, visitId, {
      kind: 'corrective',
      clientKey: randomUUID(),
      completedAt: daysAgo(0),
      primeCause: 'gremlins',
      actionTaken: 'Cleaned the detector.',
      falseAlarm: false,
    });
    expect(fieldPaths(badCause.body)).toEqual(['body.primeCause']);
  });

  it('records the cause, the work and the parts, and feeds the false-alarm record', async () => {
    const completedAt = new Date(Date.now() - 60_000).toISOString();
    const response = await complete(world.engineer, visitId, {
      kind: 'corrective',
      clientKey: randomUUID(),
      completedAt,
      primeCause: 'environment',
      actionTaken: 'Cleaned and sealed the hall detector; walk-tested every zone.',
      partsReplaced: [{ part: 'Detector lens', quantity: 1 }],
      falseAlarm: true,
      falseAlarmCause: 'A spider inside the hall detector.',
    });
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    expect(response.body).toMatchObject({
      status: 'done',
      nextDueOn: null,
      corrective: {
        reportedFault: 'Alarm went off at 3 am with nobody home.',
        primeCause: 'environment',
        primeCauseLabel: 'Environment',
        partsReplaced: [{ part: 'Detector lens', quantity: 1 }],
        falseAlarm: true,
        falseAlarmCause: 'A spider inside the hall detector.',
      },
      outcome: {
        passed: null,
        words:
          'Environment: Cleaned and sealed the hall detector; walk-tested every zone. Parts replaced: 1 × Detector lens. False alarm, caused by: A spider inside the hall detector.',
      },
    });

    // NPCC policy (../shared/checks.md): reinstatement after remedial work or 3 months clear.
    const { agent } = await as(world.office);
    const record = await agent.get(`/api/sites/${site.siteId}/false-alarms`);
    expect(record.status).toBe(200);
    expect(record.body.count).toBe(1);
    expect(record.body.correctiveVisits).toEqual([
      {
        id: visitId,
        completedAt,
        primeCause: 'environment',
        primeCauseLabel: 'Environment',
        falseAlarmCause: 'A spider inside the hall detector.',
        actionTaken: 'Cleaned and sealed the hall detector; walk-tested every zone.',
        engineerName: world.engineer.displayName,
      },
    ]);
    const lastFalseAlarmOn = ukDateOf(new Date(Date.now() - 10 * 86_400_000));
    expect(record.body.reinstatement).toMatchObject({
      needed: true,
      lastFalseAlarmOn,
      clearOn: addCalendarMonths(lastFalseAlarmOn, 3),
      remedialVisitId: visitId,
      met: true,
      items: [
        { item: 'remedial_work', met: true },
        { item: 'three_months_clear', met: false },
      ],
    });
  });
});
