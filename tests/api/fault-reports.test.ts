import { randomUUID } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import { createPerson, type TestPerson } from '../setup/factories';
import { issuePackThroughApi } from '../setup/handover-fixtures';
import { signaturePng } from '../setup/signature-png';
import { useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
let rivalOffice: TestPerson;
/** The first report, followed through its call-out into the history. */
let reportId: string;

beforeAll(async () => {
  world = currentWorld();
  await db('organisations')
    .where({ id: world.installer.id })
    .update({ phone: '+447700900321', out_of_hours_phone: '+447700900322' });
  const rival = await db('sites').where({ id: world.other.siteId }).first('installer_id');
  rivalOffice = await createPerson(db, {
    memberships: [{ role: 'office', organisationId: rival.installer_id }],
  });
});

const as = (person: TestPerson) => harness.signedInAs(person.userId);
/** Real PNG bytes (a drawn stroke), as a phone's screenshot would be. */
const photo = (seed: number) => Buffer.from(signaturePng(seed).split(',')[1]!, 'base64');
const counts = async () => ({
  reports: Number((await db('fault_reports').count('* as n'))[0]!.n),
  files: Number((await db('site_files').count('* as n'))[0]!.n),
});

async function report(
  person: TestPerson,
  siteId: string,
  fields: Record<string, string>,
  photos: { name: string; bytes: Buffer }[] = [],
) {
  const { agent, csrfToken } = await as(person);
  let pending = agent.post(`/api/my/homes/${siteId}/faults`).set('x-csrf-token', csrfToken);
  for (const [name, value] of Object.entries(fields)) pending = pending.field(name, value);
  for (const file of photos) pending = pending.attach('photos', file.bytes, file.name);
  return pending;
}

describe('a homeowner reporting a fault', () => {
  const description = 'The keypad beeps every few minutes and shows a battery symbol.';

  it('records the report with its photos and acknowledges it by e-mail', async () => {
    const clientKey = randomUUID();
    const response = await report(world.homeowner, world.own.siteId, { description, clientKey }, [
      { name: 'keypad.png', bytes: photo(1) },
      { name: '../../sounder.png', bytes: photo(2) },
    ]);
    expect(response.status, JSON.stringify(response.body)).toBe(201);
    expect(response.body).toMatchObject({
      siteId: world.own.siteId,
      description,
      status: 'open',
      statusWords: 'Reported: your installer will be in touch to arrange a visit',
      visit: null,
      acknowledgementSent: true,
    });
    expect(response.body.photos.map((item: { fileName: string }) => item.fileName)).toEqual([
      'keypad.png',
      'sounder.png',
    ]);
    reportId = response.body.id;

    // The photos are the site's files: the homeowner can open them like any other.
    const { agent } = await as(world.homeowner);
    const download = await agent.get(response.body.photos[0].url);
    expect(download.status).toBe(200);
    expect(download.headers['content-type']).toBe('image/png');

    const mail = await harness.mailbox.waitFor(
      (message) => message.to.includes(world.homeowner.email) && message.text.includes(description),
    );
    expect(mail.subject).toMatch(/^We have your fault report for Test site/);
    expect(mail.text).toContain(`Hello ${world.homeowner.displayName},`);
    expect(mail.text).toContain('With 2 photos.');
    expect(mail.text).toContain('on +447700900321 (out of hours +447700900322)');
    expect(mail.text).toContain('Do not open the control panel');
    expect(mail.text).toContain('do not go in: call 999');

    const audit = await db('audit_log').where({ entity_id: reportId }).pluck('action');
    expect(audit).toEqual(['fault_report.created']);
  });

  it('records a resend once, and e-mails once', async () => {
    const clientKey = randomUUID();
    const fields = { description: 'The outside sounder light has stopped flashing.', clientKey };
    const before = await counts();
    const first = await report(world.homeowner, world.own.siteId, fields, [
      { name: 'light.png', bytes: photo(4) },
    ]);
    const again = await report(world.homeowner, world.own.siteId, fields, [
      { name: 'light.png', bytes: photo(4) },
    ]);
    expect(first.status).toBe(201);
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    expect(await counts()).toEqual({ reports: before.reports + 1, files: before.files + 1 });
    const mails = harness.mailbox
      .list()
      .filter((mail) => mail.text.includes('The outside sounder light has stopped flashing.'));
    expect(mails).toHaveLength(1);
  });

  it('takes a report without photos as JSON', async () => {
    const { agent, csrfToken } = await as(world.homeowner);
    const response = await agent
      .post(`/api/my/homes/${world.own.siteId}/faults`)
      .set('x-csrf-token', csrfToken)
      .send({ description: 'Hall detector light stays on.' });
    expect(response.status).toBe(201);
    expect(response.body.photos).toEqual([]);
  });

  it('refuses what is not a photo, too many photos, or too short a description, saving nothing', async () => {
    const before = await counts();
    const pdf = await report(world.homeowner, world.own.siteId, { description }, [
      { name: 'photo.png', bytes: photo(5) },
      { name: 'scan.png', bytes: Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\n') },
    ]);
    expect(pdf.status).toBe(415);
    expect(pdf.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(pdf.body.errors).toEqual([
      { path: 'body.photos.1', message: 'scan is not a JPEG, PNG or WebP photo.' },
    ]);
    const five = await report(
      world.homeowner,
      world.own.siteId,
      { description },
      [1, 2, 3, 4, 5].map((seed) => ({ name: `p${seed}.png`, bytes: photo(seed) })),
    );
    expect(five.status).toBe(400);
    expect(five.body.errors[0].path).toBe('body.photos');
    const short = await report(world.homeowner, world.own.siteId, { description: 'Hm' });
    expect(short.status).toBe(400);
    expect(short.body.errors[0].path).toBe('body.description');
    expect(await counts()).toEqual(before);
  });

  it('keeps a homeowner to their own home: another’s is a 404, and other roles a 403', async () => {
    const before = await counts();
    const others = await report(world.homeowner, world.other.siteId, { description });
    expect(others.status).toBe(404);
    expect((await report(world.keyholder, world.own.siteId, { description })).status).toBe(403);
    expect((await report(world.engineer, world.own.siteId, { description })).status).toBe(403);
    expect(await counts()).toEqual(before);
  });

  it('lands in the office’s queue, and only that office’s', async () => {
    const { agent } = await as(world.office);
    const response = await agent.get('/api/service/faults');
    expect(response.status).toBe(200);
    const queued = response.body.faults.find((fault: { id: string }) => fault.id === reportId);
    expect(queued).toMatchObject({
      status: 'open',
      siteReference: expect.stringMatching(/^T-/),
      siteTown: 'Eastmere',
      reportedBy: { name: world.homeowner.displayName, email: world.homeowner.email },
    });
    expect(queued.photos).toHaveLength(2);
    const rival = await (await as(rivalOffice)).agent.get('/api/service/faults?status=all');
    expect(rival.body.faults.map((fault: { id: string }) => fault.id)).not.toContain(reportId);
    expect((await (await as(world.engineer)).agent.get('/api/service/faults')).status).toBe(403);
    const bad = await agent.get('/api/service/faults?status=lost');
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0].path).toBe('query.status');
  });

  it('is booked as a call-out, once, and closed when the call-out is done', async () => {
    const office = await as(world.office);
    const book = (clientKey: string) =>
      office.agent
        .post(`/api/sites/${world.own.siteId}/service/callouts`)
        .set('x-csrf-token', office.csrfToken)
        .send({ faultReportId: reportId, engineerId: world.engineer.userId, clientKey });
    const booked = await book(randomUUID());
    expect(booked.status, JSON.stringify(booked.body)).toBe(201);
    expect(booked.body).toMatchObject({
      kind: 'corrective',
      reportedFault: description,
      faultReportId: reportId,
      engineer: { id: world.engineer.userId },
    });
    const twice = await book(randomUUID());
    expect(twice.status).toBe(409);
    const queue = await office.agent.get('/api/service/faults');
    expect(queue.body.faults.find((fault: { id: string }) => fault.id === reportId)).toMatchObject({
      status: 'scheduled',
      visit: { id: booked.body.id, engineerName: world.engineer.displayName },
    });
    // Someone else's fault report cannot be booked on this site.
    const [foreign] = await db('fault_reports')
      .insert({ site_id: world.other.siteId, description: 'Not this site.' })
      .returning<{ id: string }[]>('id');
    const wrongSite = await office.agent
      .post(`/api/sites/${world.own.siteId}/service/callouts`)
      .set('x-csrf-token', office.csrfToken)
      .send({ faultReportId: foreign!.id });
    expect(wrongSite.status).toBe(400);
    expect(wrongSite.body.errors[0].path).toBe('body.faultReportId');

    const engineer = await as(world.engineer);
    const done = await engineer.agent
      .post(`/api/service/visits/${booked.body.id}/complete`)
      .set('x-csrf-token', engineer.csrfToken)
      .send({
        kind: 'corrective',
        clientKey: randomUUID(),
        completedAt: new Date(Date.now() - 60_000).toISOString(),
        primeCause: 'equipment_fault',
        actionTaken: 'Replaced the standby battery',
        partsReplaced: [{ part: '12 V 7 Ah battery', quantity: 1 }],
        falseAlarm: false,
      });
    expect(done.status, JSON.stringify(done.body)).toBe(200);
    const closed = await db('fault_reports').where({ id: reportId }).first();
    expect(closed.status).toBe('closed');
    expect(closed.closing_note).toMatch(
      /^Call-out done on \d{4}-\d{2}-\d{2}\. Equipment fault: Replaced the standby battery\. Parts replaced: 1 × 12 V 7 Ah battery\.$/,
    );
  });
});

describe('the homeowner’s service history', () => {
  it('shows visits done, fault reports and handover packs, newest first', async () => {
    const { packNumber } = await issuePackThroughApi(harness, db, world.own.siteId);
    const { agent } = await as(world.homeowner);
    const response = await agent.get(`/api/my/homes/${world.own.siteId}/service-history`);
    expect(response.status).toBe(200);
    const entries = response.body.entries as { kind: string; id: string; at: string }[];
    expect(entries[0]).toMatchObject({
      kind: 'handover_pack',
      packNumber,
      status: 'valid',
      title: `Handover pack ${packNumber} issued`,
      downloadUrl: `/api/packs/${packNumber}/pdf`,
    });
    expect(entries.map((entry) => entry.kind).sort()).toEqual(
      ['fault_report', 'fault_report', 'fault_report', 'handover_pack', 'visit'].sort(),
    );
    expect(entries.find((entry) => entry.kind === 'visit')).toMatchObject({
      visitKind: 'corrective',
      title: 'Call-out done',
      outcome:
        'Equipment fault: Replaced the standby battery. Parts replaced: 1 × 12 V 7 Ah battery.',
      passed: null,
    });
    expect(entries.find((entry) => entry.id === reportId)).toMatchObject({
      kind: 'fault_report',
      title: 'Fault reported',
      status: 'closed',
      statusWords: 'Dealt with',
      photoCount: 2,
    });
    const times = entries.map((entry) => entry.at);
    expect(times).toEqual([...times].sort().reverse());

    expect((await agent.get(`/api/my/homes/${world.other.siteId}/service-history`)).status).toBe(
      404,
    );
    expect(
      (
        await (
          await as(world.engineer)
        ).agent.get(`/api/my/homes/${world.own.siteId}/service-history`)
      ).status,
    ).toBe(403);
  });
});
