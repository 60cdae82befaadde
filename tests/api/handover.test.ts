import { createPublicKey, randomUUID, verify } from 'node:crypto';
import { createHash } from 'node:crypto';
import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { createSiteRecord, useSiteWorld, type SiteWorld } from '../setup/site-fixtures';
import { pageTexts } from '../setup/pdf-text';
import { signaturePng } from '../setup/signature-png';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;

/** Makes a site pass its pre-issue check: powered, graded, walk-tested and system-tested. */
async function commission(siteId: string, systemId: string) {
  await db('systems').where({ id: systemId }).update({
    psu_type: 'A',
    battery_ah: 7,
    panel_grade: 2,
    panel_quiescent_ma: 110,
    panel_alarm_ma: 160,
    notification: 'C',
  });
  await db('zones')
    .where({ system_id: systemId })
    .update({ grade: 2, environmental_class: 2, quiescent_ma: 15, alarm_ma: 25 });
  await db('keyholders').insert({
    site_id: siteId,
    call_order: 2,
    name: 'Second Keyholder',
    phone: '+447700900998',
    minutes_to_attend: 10,
  });
  await db('sites')
    .where({ id: siteId })
    .update({ urn_status: 'active', police_urn: 'EM/2026/0417' });
  const { agent, csrfToken } = await harness.signedInAs(world.engineer.userId);
  const post = (path: string, body: object) =>
    agent
      .post(`/api/sites/${siteId}/${path}`)
      .set('x-csrf-token', csrfToken)
      .send({ clientKey: randomUUID(), ...body });
  for (const zoneId of await db('zones').where({ system_id: systemId }).pluck('id')) {
    const walked = await post('walk-tests', {
      zoneId,
      secureReading: '2k2',
      alarmReading: '6k9',
      activated: true,
    });
    expect(walked.body.passed).toBe(true);
  }
  await post('system-tests', {
    kind: 'sounders',
    internalSounded: true,
    externalSounded: true,
    strobeFlashed: true,
  });
  await post('system-tests', { kind: 'signalling', pathPosition: 1, receivedByCentre: true });
  await post('system-tests', {
    kind: 'battery',
    restingVolts: 13.1,
    loadVolts: 12.5,
    loadAmps: 1.2,
    loadMinutes: 10,
  });
  const check = await agent.get(`/api/sites/${siteId}/pre-issue-check`);
  expect(
    check.body.problems.filter((p: { severity: string }) => p.severity === 'blocking'),
  ).toEqual([]);
}

beforeAll(async () => {
  world = currentWorld();
  await commission(world.own.siteId, world.own.systemId);
});

const handoverUrl = () => `/api/sites/${world.own.siteId}/handover`;
const asEngineer = () => harness.signedInAs(world.engineer.userId);
const asOffice = () => harness.signedInAs(world.office.userId);
const asHomeowner = () => harness.signedInAs(world.homeowner.userId);

async function waitForBuild(buildId: string) {
  const { agent } = await asEngineer();
  for (let attempt = 0; attempt < 200; attempt += 1) {
    const { body } = await agent.get(`/api/handover-builds/${buildId}`);
    if (body.build.status === 'done' || body.build.status === 'failed') return body.build;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error('the pack build did not finish');
}

const packCount = async () => Number((await db('handover_packs').count('* as n'))[0]!.n);

describe('pack numbering and the sealing key', () => {
  it('lets the office set a prefix, refusing anything but 2 to 6 letters', async () => {
    const { agent, csrfToken } = await asOffice();
    const bad = await agent
      .put('/api/organisation/pack-settings')
      .set('x-csrf-token', csrfToken)
      .send({ prefix: 'w-1' });
    expect(bad.status).toBe(400);
    expect(bad.body.errors[0]).toMatchObject({ path: 'body.prefix' });
    const saved = await agent
      .put('/api/organisation/pack-settings')
      .set('x-csrf-token', csrfToken)
      .send({ prefix: 'tp' });
    expect(saved.status).toBe(200);
    expect(saved.body).toMatchObject({ prefix: 'TP', nextNumber: 1 });
    // A sealing key exists from first use, published as SPKI PEM.
    expect(saved.body.keys).toHaveLength(1);
    expect(saved.body.keys[0].publicKey).toMatch(/^-----BEGIN PUBLIC KEY-----/);
    expect(saved.body.keys[0].retiredAt).toBeNull();
  });
});

describe('signing', () => {
  it('refuses to issue before both have signed, and issues nothing', async () => {
    const before = await packCount();
    const { agent, csrfToken } = await asEngineer();
    const state = await agent.get(handoverUrl());
    expect(state.status).toBe(200);
    expect(state.body.canIssue).toBe(false);
    expect(state.body.waitingFor).toEqual([
      'The engineer has not signed.',
      'The customer has not signed.',
    ]);
    const issue = await agent.post(`${handoverUrl()}/issue`).set('x-csrf-token', csrfToken);
    expect(issue.status).toBe(409);
    expect(issue.body.detail).toMatch(/engineer has not signed/);
    expect(await packCount()).toBe(before);
  });

  it('refuses a signature that is not a PNG drawing, or too large', async () => {
    const { agent, csrfToken } = await asEngineer();
    const sign = (image: unknown) =>
      agent
        .post(`${handoverUrl()}/signatures/engineer`)
        .set('x-csrf-token', csrfToken)
        .send({ image });
    const jpeg = await sign('data:image/jpeg;base64,/9j/4AAQSkZJRg==');
    expect(jpeg.status).toBe(400);
    expect(jpeg.body.errors[0]).toMatchObject({
      path: 'body.image',
      message: expect.stringMatching(/PNG image drawn on the signing pad/),
    });
    // A PNG data URL whose bytes are not a PNG.
    const fake = await sign(`data:image/png;base64,${Buffer.alloc(200, 7).toString('base64')}`);
    expect(fake.status).toBe(400);
    const huge = await sign(`data:image/png;base64,${'A'.repeat(300 * 1024)}`);
    expect(huge.status).toBe(400);
    expect(huge.body.errors[0].message).toMatch(/too large/);
    const draft = await db('handover_drafts').where({ site_id: world.own.siteId }).first();
    expect(draft.engineer_signature).toBeNull();
  });

  it('takes the engineer’s signature once', async () => {
    const { agent, csrfToken } = await asEngineer();
    const first = await agent
      .post(`${handoverUrl()}/signatures/engineer`)
      .set('x-csrf-token', csrfToken)
      .send({ image: signaturePng() });
    expect(first.status).toBe(201);
    expect(first.body.draft.engineerSignature).toMatchObject({
      name: world.engineer.displayName,
    });
    const again = await agent
      .post(`${handoverUrl()}/signatures/engineer`)
      .set('x-csrf-token', csrfToken)
      .send({ image: signaturePng() });
    expect(again.status).toBe(409);
    expect(again.body.detail).toMatch(/already signed/);
  });

  it('e-mails the homeowner a signing request that only they can open and sign, once', async () => {
    const { agent, csrfToken } = await asEngineer();
    const notTheirs = await agent
      .post(`${handoverUrl()}/signing-request`)
      .set('x-csrf-token', csrfToken)
      .send({ homeownerUserId: world.otherHomeowner.userId });
    expect(notTheirs.status).toBe(400);
    const sent = await agent
      .post(`${handoverUrl()}/signing-request`)
      .set('x-csrf-token', csrfToken)
      .send({ homeownerUserId: world.homeowner.userId });
    expect(sent.status).toBe(201);
    const requestId = sent.body.draft.signingRequest.id as string;
    const mail = await harness.mailbox.waitFor(
      (message) =>
        message.to.includes(world.homeowner.email) && /countersign/.test(message.subject),
    );
    expect(mail.text).toContain(`/homeowner/sign/${requestId}`);

    const stranger = await harness.signedInAs(world.otherHomeowner.userId);
    expect((await stranger.agent.get(`/api/my/signing-requests/${requestId}`)).status).toBe(404);
    const strangerSigns = await stranger.agent
      .post(`/api/my/signing-requests/${requestId}/sign`)
      .set('x-csrf-token', stranger.csrfToken)
      .send({ name: 'Not Them', image: signaturePng() });
    expect(strangerSigns.status).toBe(404);

    const homeowner = await asHomeowner();
    const opened = await homeowner.agent.get(`/api/my/signing-requests/${requestId}`);
    expect(opened.body).toMatchObject({ signed: false, engineerName: world.engineer.displayName });
    const preview = await homeowner.agent.get(opened.body.previewUrl);
    expect(preview.status).toBe(200);
    expect(preview.headers['content-type']).toBe('application/pdf');
    expect(preview.body.subarray(0, 5).toString()).toBe('%PDF-');
    const signed = await homeowner.agent
      .post(`/api/my/signing-requests/${requestId}/sign`)
      .set('x-csrf-token', homeowner.csrfToken)
      .send({ name: world.homeowner.displayName, image: signaturePng() });
    expect(signed.status).toBe(201);
    expect(signed.body.signed).toBe(true);
    const twice = await homeowner.agent
      .post(`/api/my/signing-requests/${requestId}/sign`)
      .set('x-csrf-token', homeowner.csrfToken)
      .send({ name: world.homeowner.displayName, image: signaturePng() });
    expect(twice.status).toBe(409);
  });
});

describe('issue, download and verification', () => {
  let packNumber: string;
  let pdf: Buffer;

  it('issues a numbered, sealed pack off the request path and e-mails it', async () => {
    const { agent, csrfToken } = await asEngineer();
    const state = await agent.get(handoverUrl());
    expect(state.body).toMatchObject({ canIssue: true, waitingFor: [] });
    const issued = await agent.post(`${handoverUrl()}/issue`).set('x-csrf-token', csrfToken);
    expect(issued.status).toBe(202);
    const build = await waitForBuild(issued.body.build.id);
    expect(build).toMatchObject({ status: 'done', stage: 'done', percent: 100 });
    packNumber = build.packNumber;
    expect(packNumber).toBe('TP-000001-R1');

    const mail = await harness.mailbox.waitFor((message) => message.subject.includes(packNumber));
    expect(mail.to).toContain(world.homeowner.email);
    expect(mail.attachments).toEqual([
      expect.objectContaining({ filename: `${packNumber}.pdf`, contentType: 'application/pdf' }),
    ]);
    // The draft is used up: the next handover starts unsigned.
    const after = await agent.get(handoverUrl());
    expect(after.body.draft.engineerSignature).toBeNull();
    expect(after.body.packs[0]).toMatchObject({ packNumber, status: 'valid' });
  });

  it('lets the homeowner list and download it, and the hash is of those bytes', async () => {
    const { agent } = await asHomeowner();
    const documents = await agent.get('/api/my/documents');
    expect(documents.body.packs).toEqual([
      expect.objectContaining({ packNumber, status: 'valid', siteId: world.own.siteId }),
    ]);
    const download = await agent
      .get(`/api/packs/${packNumber}/pdf`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(download.status).toBe(200);
    expect(download.headers['content-disposition']).toContain(`${packNumber}.pdf`);
    pdf = download.body as Buffer;
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const row = await db('handover_packs').where({ pack_number: packNumber }).first();
    expect(createHash('sha256').update(pdf).digest('hex')).toBe(row.sha256);
    // The frozen snapshot holds the values the PDF was drawn from.
    expect(row.snapshot.site.name).toBe(
      (await db('sites').where({ id: world.own.siteId }).first()).name,
    );
    expect(row.snapshot.customer.name).toBe(world.homeowner.displayName);

    // Read back with pdf.js, a reader the project did not write: the site's own values.
    const pages = await pageTexts(pdf);
    const text = pages.join(' ');
    const site = await db('sites').where({ id: world.own.siteId }).first();
    for (const page of pages) expect(page).toContain(packNumber);
    for (const expected of [
      site.name,
      site.postcode,
      'Completion certificate',
      'As-fitted zone schedule',
      'Power budget',
      'Room 1',
      'Room 2',
      'Test Keyholder',
      'Second Keyholder',
      'EM/2026/0417',
      world.homeowner.displayName,
      world.engineer.displayName,
      `/verify/${packNumber}`,
    ]) {
      expect(text, expected).toContain(expected);
    }
    expect(text).not.toContain('PREVIEW');

    const stranger = await harness.signedInAs(world.otherHomeowner.userId);
    expect((await stranger.agent.get(`/api/packs/${packNumber}/pdf`)).status).toBe(404);
    expect((await stranger.agent.get('/api/my/documents')).body.packs).toEqual([]);
  });

  it('publishes a seal that node:crypto verifies, and that fails after any one-byte change', async () => {
    const response = await request(harness.app).get(`/api/verify/${packNumber}`);
    expect(response.status).toBe(200);
    const { seal, sha256, status } = response.body;
    expect(status).toBe('valid');
    expect(seal.algorithm).toBe('Ed25519');
    expect(seal.valid).toBe(true);
    expect(seal.signedText).toContain(`pack: ${packNumber}`);
    expect(seal.signedText).toContain(`sha256: ${sha256}`);
    // RFC 8032 Ed25519 through node:crypto, not through Wardbook's own code.
    const publicKey = createPublicKey(seal.publicKey);
    const signature = Buffer.from(seal.signature, 'base64');
    const text = Buffer.from(seal.signedText, 'utf8');
    expect(verify(null, text, publicKey, signature)).toBe(true);
    for (const index of [0, Math.floor(text.length / 2), text.length - 2]) {
      const changed = Buffer.from(text);
      changed[index] = changed[index]! ^ 0x01;
      expect(verify(null, changed, publicKey, signature), `text byte ${index}`).toBe(false);
    }
    const badSignature = Buffer.from(signature);
    badSignature[10] = badSignature[10]! ^ 0x01;
    expect(verify(null, text, publicKey, badSignature)).toBe(false);
    // The PDF's own hash is what was sealed; one changed byte gives another hash.
    const flipped = Buffer.from(pdf);
    flipped[200] = flipped[200]! ^ 0x01;
    expect(createHash('sha256').update(flipped).digest('hex')).not.toBe(sha256);
  });

  it('checks an uploaded copy byte for byte, and says so plainly when it does not match', async () => {
    const check = (bytes: Buffer) =>
      request(harness.app)
        .post(`/api/verify/${packNumber}/check`)
        .set('Content-Type', 'application/pdf')
        .send(bytes);
    const exact = await check(pdf);
    expect(exact.body).toMatchObject({ matches: true, uploadedBytes: pdf.length });
    const tampered = Buffer.from(pdf);
    tampered[pdf.length - 100] = tampered[pdf.length - 100]! ^ 0x20;
    const altered = await check(tampered);
    expect(altered.status).toBe(200);
    expect(altered.body.matches).toBe(false);
    expect(altered.body.message).toMatch(/does not match/);
    const truncated = await check(pdf.subarray(0, pdf.length - 1));
    expect(truncated.body.matches).toBe(false);
    const empty = await request(harness.app).post(`/api/verify/${packNumber}/check`);
    expect(empty.status).toBe(400);
  });

  it('answers an unknown or malformed pack number with a clear 404', async () => {
    for (const number of ['TP-999999-R1', 'not-a-pack']) {
      const response = await request(harness.app).get(`/api/verify/${number}`);
      expect(response.status).toBe(404);
      expect(response.headers['content-type']).toContain('application/problem+json');
      expect(response.body.detail).toMatch(/No handover pack/);
    }
  });

  it('cannot be altered by SQL, even by the app’s own database user', async () => {
    await expect(
      db('handover_packs')
        .where({ pack_number: packNumber })
        .update({ sha256: '0'.repeat(64) }),
    ).rejects.toThrow(/cannot be changed/);
    await expect(db('handover_packs').where({ pack_number: packNumber }).delete()).rejects.toThrow(
      /cannot be changed/,
    );
    // And the API has no way to edit one.
    const { agent, csrfToken } = await asOffice();
    const put = await agent
      .put(`/api/packs/${packNumber}`)
      .set('x-csrf-token', csrfToken)
      .send({ sha256: 'x' });
    expect(put.status).toBe(404);
  });

  it('supersedes it with a revision, and keeps the sequence gap-free across sites', async () => {
    const { agent, csrfToken } = await asEngineer();
    await agent
      .post(`${handoverUrl()}/signatures/engineer`)
      .set('x-csrf-token', csrfToken)
      .send({ image: signaturePng() });
    await agent
      .post(`${handoverUrl()}/signatures/customer`)
      .set('x-csrf-token', csrfToken)
      .send({ name: world.homeowner.displayName, image: signaturePng() });
    const issued = await agent.post(`${handoverUrl()}/issue`).set('x-csrf-token', csrfToken);
    const revision = await waitForBuild(issued.body.build.id);
    expect(revision.packNumber).toBe('TP-000001-R2');
    const old = await request(harness.app).get(`/api/verify/${packNumber}`);
    expect(old.body).toMatchObject({ status: 'superseded', supersededBy: 'TP-000001-R2' });
    expect(old.body.seal.valid).toBe(true);

    // A second site of the same installer takes the next number.
    const second = await createSiteRecord(db, {
      installerId: world.installer.id,
      monitoringCentreId: world.centre.id,
      homeownerId: world.homeowner.userId,
    });
    await commission(second.siteId, second.systemId);
    const url = `/api/sites/${second.siteId}/handover`;
    await agent
      .post(`${url}/signatures/engineer`)
      .set('x-csrf-token', csrfToken)
      .send({ image: signaturePng() });
    await agent
      .post(`${url}/signatures/customer`)
      .set('x-csrf-token', csrfToken)
      .send({ name: world.homeowner.displayName, image: signaturePng() });
    const next = await waitForBuild(
      (await agent.post(`${url}/issue`).set('x-csrf-token', csrfToken)).body.build.id,
    );
    expect(next.packNumber).toBe('TP-000002-R1');
  });

  it('keeps old seals verifiable after the office rotates the key', async () => {
    const { agent, csrfToken } = await asOffice();
    const rotated = await agent
      .post('/api/organisation/seal-keys/rotate')
      .set('x-csrf-token', csrfToken);
    expect(rotated.status).toBe(200);
    expect(rotated.body.keys).toHaveLength(2);
    expect(
      rotated.body.keys.filter((key: { retiredAt: string | null }) => !key.retiredAt),
    ).toHaveLength(1);
    const old = await request(harness.app).get(`/api/verify/${packNumber}`);
    expect(old.body.seal.valid).toBe(true);
    const published = await request(harness.app).get('/api/seal-keys');
    expect(published.body.keys.map((key: { keyId: string }) => key.keyId)).toContain(
      old.body.seal.keyId,
    );
  });

  it('lets the office revoke a pack with a reason, shown on verification', async () => {
    const { agent, csrfToken } = await asOffice();
    const revoked = await agent
      .post('/api/packs/TP-000002-R1/revoke')
      .set('x-csrf-token', csrfToken)
      .send({ reason: 'Issued for the wrong site.' });
    expect(revoked.status).toBe(200);
    expect(revoked.body.status).toBe('revoked');
    const shown = await request(harness.app).get('/api/verify/TP-000002-R1');
    expect(shown.body).toMatchObject({
      status: 'revoked',
      revokedReason: 'Issued for the wrong site.',
    });
    const again = await agent
      .post('/api/packs/TP-000002-R1/revoke')
      .set('x-csrf-token', csrfToken)
      .send({ reason: 'Twice.' });
    expect(again.status).toBe(409);
  });
});

describe('variations', () => {
  it('needs each blocking problem written down and accepted before a failing site is issued', async () => {
    const site = await createSiteRecord(db, {
      installerId: world.installer.id,
      monitoringCentreId: world.centre.id,
      homeownerId: world.homeowner.userId,
    });
    const url = `/api/sites/${site.siteId}/handover`;
    const { agent, csrfToken } = await asEngineer();
    const state = await agent.get(url);
    expect(state.body.blocking.length).toBeGreaterThan(0);
    expect(state.body.waitingFor[0]).toMatch(/no written variation/);
    await agent
      .post(`${url}/signatures/customer`)
      .set('x-csrf-token', csrfToken)
      .send({ name: 'Pat Customer', image: signaturePng() });
    const written = await agent
      .put(`${url}/variations`)
      .set('x-csrf-token', csrfToken)
      .send({
        variations: state.body.blocking.map((text: string) => `Accepted as it is: ${text}`),
        version: (await agent.get(url)).body.draft.version,
      });
    expect(written.status).toBe(200);
    // A new list of variations needs the customer's signature again.
    expect(written.body.draft.customerSignature).toBeNull();
    expect(written.body.waitingFor).toEqual([
      'The engineer has not signed.',
      'The customer has not signed.',
    ]);
    const stale = await agent
      .put(`${url}/variations`)
      .set('x-csrf-token', csrfToken)
      .send({ variations: ['x'], version: 1 });
    expect(stale.status).toBe(409);
    const blank = await agent
      .put(`${url}/variations`)
      .set('x-csrf-token', csrfToken)
      .send({ variations: ['  '], version: written.body.draft.version });
    expect(blank.status).toBe(400);
    expect(blank.body.errors[0].path).toBe('body.variations.0');
  });
});

describe('who may do what', () => {
  it('keeps another installer’s staff, and the homeowner, out of the handover', async () => {
    const rival = await harness.signedInAs(world.engineer.userId);
    expect((await rival.agent.get(`/api/sites/${world.other.siteId}/handover`)).status).toBe(404);
    const homeowner = await asHomeowner();
    expect((await homeowner.agent.get(handoverUrl())).status).toBe(403);
    const office = await asOffice();
    // The office may prepare a handover but only an engineer signs and issues it.
    const signs = await office.agent
      .post(`${handoverUrl()}/signatures/engineer`)
      .set('x-csrf-token', office.csrfToken)
      .send({ image: signaturePng() });
    expect(signs.status).toBe(403);
  });
});
