import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { createLogger } from '../../server/http/logger';
import { queueServiceReport } from '../../server/service-report/repository';
import { runServiceReport } from '../../server/service-report/service';
import { createPerson, type TestPerson } from '../setup/factories';
import { pageTexts } from '../setup/pdf-text';
import { signaturePng } from '../setup/signature-png';
import { useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
let pathId: string;
let visitId: string;
let completed: Record<string, unknown> & { nextDueOn: string; completedAt: string };

const as = (person: TestPerson) => harness.signedInAs(person.userId);

/** Midday UK time yesterday: a finished visit's time that no clock skew reaches. */
function yesterdayMidday() {
  const at = new Date(Date.now() - 86_400_000);
  at.setUTCHours(11, 30, 0, 0);
  return at.toISOString();
}

/** "1 June 2027", formatted here independently of the renderer's own helper. */
const longDate = (day: string) =>
  new Date(`${day}T12:00:00Z`).toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'long',
    year: 'numeric',
    timeZone: 'Europe/London',
  });

async function download(person: TestPerson, id: string) {
  const { agent } = await as(person);
  return agent
    .get(`/api/service/visits/${id}/report.pdf`)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
}

async function waitForReport(id: string) {
  for (let attempt = 0; attempt < 150; attempt += 1) {
    const row = await db('service_reports').where({ visit_id: id }).first();
    if (row && row.status !== 'queued') return row;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error('the service report was not drawn');
}

beforeAll(async () => {
  world = currentWorld();
  // A system the calculations can judge: supply, battery and currents.
  await db('systems').where({ id: world.own.systemId }).update({
    psu_type: 'A',
    battery_ah: 7,
    panel_quiescent_ma: 110,
    panel_alarm_ma: 160,
  });
  await db('zones')
    .where({ system_id: world.own.systemId })
    .update({ quiescent_ma: 15, alarm_ma: 25 });
  await db('sites')
    .where({ id: world.own.siteId })
    .update({ hazards: 'Fragile roof over the garage' });
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

  const office = await as(world.office);
  const booked = await office.agent
    .post(`/api/sites/${world.own.siteId}/service/visits`)
    .set('x-csrf-token', office.csrfToken)
    .send({ kind: 'preventive', engineerId: world.engineer.userId });
  expect(booked.status).toBe(201);
  visitId = booked.body.id;

  const engineer = await as(world.engineer);
  const response = await engineer.agent
    .post(`/api/service/visits/${visitId}/complete`)
    .set('x-csrf-token', engineer.csrfToken)
    .send({
      kind: 'preventive',
      clientKey: randomUUID(),
      completedAt: yesterdayMidday(),
      battery: { restingVolts: 13.1, loadTestVolts: 12.4, loadTestAmps: 1.5 },
      zones: [
        {
          zoneId: world.own.zoneIds[0],
          secureReading: '2k2',
          alarmReading: '6k9',
          activated: true,
        },
      ],
      tampers: { result: 'passed' },
      sounders: { internal: { result: 'passed' }, external: { result: 'none_fitted' } },
      signalling: [{ pathId, result: 'passed', centreReference: 'T-4471' }],
      userTrainingGiven: true,
      userConfidence: 'fairly confident',
      notTested: [{ item: 'zone', zoneId: world.own.zoneIds[1], reason: 'The room was locked.' }],
      customerName: 'Ada Customer',
      customerSignature: signaturePng(5),
    });
  expect(response.status, JSON.stringify(response.body)).toBe(200);
  completed = response.body;
});

describe('the service report of a completed visit', () => {
  it('is queued with the completion itself, then drawn by the job', async () => {
    // The completion answered before the report was drawn; its row was written with it.
    expect(await db('service_reports').where({ visit_id: visitId }).first()).toBeDefined();
    const report = await waitForReport(visitId);
    expect(report).toMatchObject({ status: 'done', error: null });
    expect(report.size_bytes).toBeGreaterThan(1000);
  });

  it('holds the visit’s real values, read back with pdf.js', async () => {
    const response = await download(world.homeowner, visitId);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    const pdf = response.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const text = (await pageTexts(pdf)).join(' ');
    const site = await db('sites').where({ id: world.own.siteId }).first();
    const installer = await db('organisations').where({ id: world.installer.id }).first('name');
    for (const expected of [
      'Service report',
      site.name,
      site.reference,
      site.postcode,
      installer.name,
      world.engineer.displayName,
      longDate(completed.completedAt.slice(0, 10)),
      // The next visit six months on: two a year for a monitored system (BS 8243; see
      // server/calc/service-plan.ts for the rule and its source).
      longDate(completed.nextDueOn),
      // Battery: the readings as entered, and the verdict.
      '13.10 V',
      '12.40 V at 1.5 A',
      // Zone 1 on a two-resistor loop: 2k2 set reads normal, 2k2 + 4k7 = 6k9 in alarm
      // (common practice, no source; ../shared/checks.md).
      'Room 1',
      '2.2 kΩ',
      '6.9 kΩ',
      'Normal',
      'Alarm',
      'PASS',
      // Tests.
      'Tampers',
      'None fitted',
      'Signalling path 1 (ip): Primary path to the centre',
      'Centre reference T-4471',
      '3 of 5, fairly confident',
      // What was not tested, and who signed for it.
      'Zone 2 (Room 2)',
      'The room was locked.',
      'Ada Customer',
      // The safety note, with the hazard recorded at the site.
      'Fragile roof over the garage',
      'signs of forced entry',
      'mains isolation',
      'asbestos',
      'Page 1 of',
    ])
      expect(text).toContain(expected);
    // The customer's drawn signature is on the page as an image.
    expect(pdf.toString('latin1')).toMatch(/\/Subtype\s*\/Image/);
  });

  it('is e-mailed to the site’s homeowner with the same PDF attached', async () => {
    const mail = await harness.mailbox.waitFor(
      (message) =>
        message.to.includes(world.homeowner.email) && /Service report/.test(message.subject),
    );
    expect(mail.attachments).toEqual([expect.objectContaining({ contentType: 'application/pdf' })]);
    const attached = harness.mailbox.attachment(mail.id, 0)!;
    const stored = (await download(world.engineer, visitId)).body as Buffer;
    expect(attached.content.equals(stored)).toBe(true);
    expect(
      harness.mailbox.list().filter((message) => message.to.includes(world.otherHomeowner.email)),
    ).toEqual([]);
  });

  it('is linked from the homeowner’s service history', async () => {
    const { agent } = await as(world.homeowner);
    const { body } = await agent
      .get(`/api/my/homes/${world.own.siteId}/service-history`)
      .expect(200);
    const entry = body.entries.find((item: { id: string }) => item.id === visitId);
    expect(entry).toMatchObject({
      kind: 'visit',
      reportUrl: `/api/service/visits/${visitId}/report.pdf`,
    });
    expect((await agent.get(entry.reportUrl)).status).toBe(200);
  });

  it('is for the installer’s staff and the site’s homeowners only', async () => {
    expect((await download(world.office, visitId)).status).toBe(200);
    expect((await download(world.engineer, visitId)).status).toBe(200);
    const otherHomeowner = await download(world.otherHomeowner, visitId);
    expect(otherHomeowner.status).toBe(404);
    expect(otherHomeowner.headers['content-type']).toContain('application/problem+json');
    const rival = await db('sites').where({ id: world.other.siteId }).first('installer_id');
    const rivalOffice = await createPerson(db, {
      memberships: [{ role: 'office', organisationId: rival.installer_id }],
    });
    expect((await download(rivalOffice, visitId)).status).toBe(404);
    // Known to the site, but not holding its papers.
    expect((await download(world.keyholder, visitId)).status).toBe(403);
    expect((await download(world.operator, visitId)).status).toBe(403);
    expect((await download(world.homeowner, randomUUID())).status).toBe(404);
    const badId = await download(world.homeowner, 'not-a-visit');
    expect(badId.status).toBe(400);
    expect(badId.headers['content-type']).toContain('application/problem+json');
  });

  it('says so, rather than serving nothing, for a visit not completed yet', async () => {
    const open = await db('service_visits')
      .insert({ site_id: world.own.siteId, kind: 'corrective', due_date: '2026-12-31' })
      .returning<{ id: string }[]>('id');
    const response = await download(world.homeowner, open[0]!.id);
    expect(response.status).toBe(404);
    expect(JSON.parse(response.body.toString()).detail).toBe(
      'This visit has no report: it is not completed yet.',
    );
  });

  it('reports a call-out with its fault, cause, work and parts', async () => {
    const engineer = await as(world.engineer);
    const booked = await engineer.agent
      .post(`/api/sites/${world.own.siteId}/service/callouts`)
      .set('x-csrf-token', engineer.csrfToken)
      .send({ reportedFault: 'The hall sounder went off twice overnight.' });
    expect(booked.status).toBe(201);
    const done = await engineer.agent
      .post(`/api/service/visits/${booked.body.id}/complete`)
      .set('x-csrf-token', engineer.csrfToken)
      .send({
        kind: 'corrective',
        clientKey: randomUUID(),
        completedAt: new Date(Date.now() - 60_000).toISOString(),
        primeCause: 'environment',
        actionTaken: 'Moved the hall detector away from the radiator.',
        partsReplaced: [{ part: 'Detector bracket', quantity: 2 }],
        falseAlarm: true,
        falseAlarmCause: 'Warm air from the radiator.',
      });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    expect(await waitForReport(booked.body.id)).toMatchObject({ status: 'done' });
    const response = await download(world.homeowner, booked.body.id);
    expect(response.status).toBe(200);
    const text = (await pageTexts(response.body as Buffer)).join(' ');
    for (const expected of [
      'CORRECTIVE VISIT',
      'The hall sounder went off twice overnight.',
      done.body.corrective.primeCauseLabel,
      'Moved the hall detector away from the radiator.',
      '2 × Detector bracket',
      'Yes: Warm air from the radiator.',
      world.engineer.displayName,
      'signs of forced entry',
    ])
      expect(text).toContain(expected);
  });

  it('is drawn and e-mailed once when its job runs twice at the same time', async () => {
    // As after a restart that lost the job: the report is queued again and two workers race.
    const before = await db('service_reports').where({ visit_id: visitId }).first();
    await db('service_reports').where({ id: before.id }).delete();
    await queueServiceReport(db, { visitId, siteId: world.own.siteId });
    const report = await db('service_reports').where({ visit_id: visitId }).first();
    const deps = {
      db,
      storage: harness.storage,
      mailer: harness.mailer,
      logger: createLogger('silent', 'test'),
    };
    const reportMails = () =>
      harness.mailbox
        .list()
        .filter((message) =>
          message.subject.endsWith(`visit of ${completed.completedAt.slice(0, 10)}`),
        );
    const mailsBefore = reportMails().length;
    await Promise.all([runServiceReport(deps, report.id), runServiceReport(deps, report.id)]);
    // A third run finds it done and does nothing.
    await runServiceReport(deps, report.id);
    // The mailer has handed every message to the SMTP catcher by the time send() resolves.
    expect(reportMails()).toHaveLength(mailsBefore + 1);
    expect(await db('service_reports').where({ id: report.id }).first()).toMatchObject({
      status: 'done',
    });
    expect((await download(world.homeowner, visitId)).status).toBe(200);
  });
});
