import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApiHarness } from '../setup/api-app';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation, createPerson, type TestPerson } from '../setup/factories';

const db = testDb();
const harness = await buildApiHarness(db);
let installer: { id: string; name: string };
let centre: { id: string; name: string };
let office: TestPerson;
let engineer: TestPerson;

beforeAll(async () => {
  installer = await createOrganisation(db, 'installer', 'Sites Test Installer');
  centre = await createOrganisation(db, 'monitoring_centre', 'Sites Test Centre');
  office = await createPerson(db, {
    memberships: [{ role: 'office', organisationId: installer.id }],
    name: 'Olive Office',
  });
  engineer = await createPerson(db, {
    memberships: [{ role: 'engineer', organisationId: installer.id }],
    name: 'Ezra Engineer',
  });
});
afterAll(async () => {
  await harness.close();
  await closeTestDb();
});

const newSite = (overrides: Record<string, unknown> = {}) => ({
  name: 'Okonjo residence',
  premisesType: 'domestic',
  addressLine1: '14 Heron Close',
  town: 'Eastmere',
  postcode: 'em1 4qt',
  accessNotes: 'Key with the neighbour at 16.',
  hazards: 'Dog in the kitchen.',
  requiredGrade: 2,
  gradeRationale: 'Typical domestic risk.',
  environmentalClass: 2,
  ...overrides,
});

async function asOffice() {
  return harness.signedInAs(office.userId);
}

describe('creating a site', () => {
  it('records the site with a numbered reference, a normalised postcode and an audit entry', async () => {
    const { agent, csrfToken } = await asOffice();
    const response = await agent.post('/api/sites').set('x-csrf-token', csrfToken).send(newSite());
    expect(response.status).toBe(201);
    expect(response.body).toMatchObject({
      name: 'Okonjo residence',
      postcode: 'EM1 4QT',
      reference: expect.stringMatching(/^S-\d{4}$/),
      installer: { id: installer.id, name: 'Sites Test Installer' },
      monitoringCentre: null,
      version: 1,
      counts: { zones: 0, keyholders: 0 },
    });
    const audit = await db('audit_log').where({
      entity_id: response.body.id,
      action: 'site.created',
    });
    expect(audit).toHaveLength(1);
    expect(audit[0].actor_user_id).toBe(office.userId);
  });

  it('numbers references in sequence per installer', async () => {
    const { agent, csrfToken } = await asOffice();
    const first = await agent
      .post('/api/sites')
      .set('x-csrf-token', csrfToken)
      .send(newSite({ name: 'A' }));
    const second = await agent
      .post('/api/sites')
      .set('x-csrf-token', csrfToken)
      .send(newSite({ name: 'B' }));
    const number = (reference: string) => Number(reference.slice(2));
    expect(number(second.body.reference)).toBe(number(first.body.reference) + 1);
  });

  it('explains bad input field by field and saves nothing', async () => {
    const before = await db('sites').count('* as n').first();
    const { agent, csrfToken } = await asOffice();
    const response = await agent
      .post('/api/sites')
      .set('x-csrf-token', csrfToken)
      .send(
        newSite({ postcode: 'NOT A POSTCODE', requiredGrade: 5, environmentalClass: 0, name: '' }),
      );
    expect(response.status).toBe(400);
    const paths = response.body.errors.map((error: { path: string }) => error.path);
    expect(paths).toEqual(
      expect.arrayContaining([
        'body.postcode',
        'body.requiredGrade',
        'body.environmentalClass',
        'body.name',
      ]),
    );
    expect(
      response.body.errors.find((e: { path: string }) => e.path === 'body.postcode').message,
    ).toBe('Enter a UK postcode such as AB1 2DE.');
    expect(await db('sites').count('* as n').first()).toEqual(before);
  });

  it('needs both a monitoring centre and an account number, and a URN for police response', async () => {
    const { agent, csrfToken } = await asOffice();
    const half = await agent
      .post('/api/sites')
      .set('x-csrf-token', csrfToken)
      .send(newSite({ monitoringCentreId: centre.id, urnStatus: 'active' }));
    expect(half.status).toBe(400);
    expect(half.body.errors).toEqual(
      expect.arrayContaining([
        {
          path: 'body.monitoringAccount',
          message: 'A monitored site needs both its monitoring centre and its account number.',
        },
        { path: 'body.policeUrn', message: 'Police response needs the URN the police issued.' },
      ]),
    );
    const whole = await agent
      .post('/api/sites')
      .set('x-csrf-token', csrfToken)
      .send(
        newSite({
          monitoringCentreId: centre.id,
          monitoringAccount: 'a1b2',
          urnStatus: 'active',
          policeUrn: 'EM/2026/77',
        }),
      );
    expect(whole.status).toBe(201);
    expect(whole.body).toMatchObject({
      monitoringCentre: { id: centre.id },
      monitoringAccount: 'A1B2',
    });

    const duplicate = await agent
      .post('/api/sites')
      .set('x-csrf-token', csrfToken)
      .send(newSite({ monitoringCentreId: centre.id, monitoringAccount: 'A1B2' }));
    expect(duplicate.status).toBe(400);
    expect(duplicate.body.errors[0]).toEqual({
      path: 'body.monitoringAccount',
      message: 'That account number is already in use at this monitoring centre.',
    });
  });

  it('refuses a monitoring centre that is not one', async () => {
    const { agent, csrfToken } = await asOffice();
    const response = await agent
      .post('/api/sites')
      .set('x-csrf-token', csrfToken)
      .send(newSite({ monitoringCentreId: installer.id, monitoringAccount: '123' }));
    expect(response.status).toBe(400);
    expect(response.body.errors[0].path).toBe('body.monitoringCentreId');
  });
});

describe('editing a site', () => {
  it('applies a partial edit at the current version and keeps every other field', async () => {
    const { agent, csrfToken } = await asOffice();
    const created = (
      await agent
        .post('/api/sites')
        .set('x-csrf-token', csrfToken)
        .send(
          newSite({
            monitoringCentreId: centre.id,
            monitoringAccount: 'BEEF',
            hazards: 'Steep steps.',
          }),
        )
    ).body;
    const edited = await agent
      .patch(`/api/sites/${created.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ accessNotes: 'Key safe by the gate.', version: created.version });
    expect(edited.status).toBe(200);
    expect(edited.body).toMatchObject({
      accessNotes: 'Key safe by the gate.',
      hazards: 'Steep steps.',
      monitoringAccount: 'BEEF',
      monitoringCentre: { id: centre.id },
      version: created.version + 1,
    });
    const audit = await db('audit_log')
      .where({ entity_id: created.id, action: 'site.updated' })
      .first();
    expect(audit.changes).toEqual({
      access_notes: { from: 'Key with the neighbour at 16.', to: 'Key safe by the gate.' },
    });
  });

  it('refuses a stale edit with 409 and changes nothing', async () => {
    const { agent, csrfToken } = await asOffice();
    const created = (await agent.post('/api/sites').set('x-csrf-token', csrfToken).send(newSite()))
      .body;
    await agent
      .patch(`/api/sites/${created.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ name: 'First edit', version: 1 });
    const stale = await agent
      .patch(`/api/sites/${created.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ name: 'Second edit from an old form', version: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.type).toBe('/problems/conflict');
    expect((await agent.get(`/api/sites/${created.id}`)).body.name).toBe('First edit');
  });

  it('checks cross-field rules against the stored record', async () => {
    const { agent, csrfToken } = await asOffice();
    const created = (await agent.post('/api/sites').set('x-csrf-token', csrfToken).send(newSite()))
      .body;
    const response = await agent
      .patch(`/api/sites/${created.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ urnStatus: 'active', version: created.version });
    expect(response.status).toBe(400);
    expect(response.body.errors[0].path).toBe('body.policeUrn');
  });
});

describe('the sites list', () => {
  beforeAll(async () => {
    const { agent, csrfToken } = await asOffice();
    for (const [index, town] of ['Fernmoor', 'Little Haldon', 'Fernmoor'].entries()) {
      await agent
        .post('/api/sites')
        .set('x-csrf-token', csrfToken)
        .send(newSite({ name: `Listing ${index} 50%`, town, requiredGrade: index + 2 }));
    }
  });

  it('pages, sorts and counts on the server', async () => {
    const { agent } = await asOffice();
    const first = await agent.get('/api/sites?pageSize=5&sort=name&order=desc');
    expect(first.status).toBe(200);
    expect(first.body.items).toHaveLength(5);
    expect(first.body.total).toBeGreaterThanOrEqual(8);
    const names = first.body.items.map((item: { name: string }) => item.name);
    expect([...names].sort().reverse()).toEqual(names);
    const last = await agent.get(`/api/sites?pageSize=5&page=${Math.ceil(first.body.total / 5)}`);
    expect(last.body.items.length).toBeGreaterThan(0);
    const beyond = await agent.get('/api/sites?pageSize=5&page=999');
    expect(beyond.body).toMatchObject({ items: [], total: first.body.total });
  });

  it('searches names, towns and postcodes by fragment, taking % literally', async () => {
    const { agent } = await asOffice();
    const byTown = await agent.get('/api/sites?q=little%20hal');
    expect(byTown.body.items.map((item: { town: string }) => item.town)).toEqual(['Little Haldon']);
    const literal = await agent.get(`/api/sites?q=${encodeURIComponent('50%')}`);
    expect(literal.body.total).toBe(3);
  });

  it('filters by grade, monitoring and assigned engineer', async () => {
    const { agent, csrfToken } = await asOffice();
    const grade4 = await agent.get('/api/sites?grade=4');
    expect(
      grade4.body.items.every((item: { requiredGrade: number }) => item.requiredGrade === 4),
    ).toBe(true);
    const monitored = await agent.get('/api/sites?monitored=yes');
    expect(
      monitored.body.items.every(
        (item: { monitoringCentre: unknown }) => item.monitoringCentre !== null,
      ),
    ).toBe(true);

    const target = grade4.body.items[0];
    const assigned = await agent
      .put(`/api/sites/${target.id}/engineers`)
      .set('x-csrf-token', csrfToken)
      .send({ userIds: [engineer.userId] });
    expect(assigned.body.engineers).toEqual([
      { id: engineer.userId, displayName: 'Ezra Engineer' },
    ]);
    const mine = await agent.get(`/api/sites?engineerId=${engineer.userId}`);
    expect(mine.body.items.map((item: { id: string }) => item.id)).toEqual([target.id]);
    expect(mine.body.items[0].engineers).toEqual([
      { id: engineer.userId, displayName: 'Ezra Engineer' },
    ]);
  });

  it('rejects unknown sort columns and silly page sizes', async () => {
    const { agent } = await asOffice();
    const response = await agent.get('/api/sites?sort=password&pageSize=100000');
    expect(response.status).toBe(400);
    expect(response.body.errors.map((error: { path: string }) => error.path).sort()).toEqual([
      'query.pageSize',
      'query.sort',
    ]);
  });
});

describe('people on a site', () => {
  it('assigns only engineers of the same company', async () => {
    const { agent, csrfToken } = await asOffice();
    const created = (await agent.post('/api/sites').set('x-csrf-token', csrfToken).send(newSite()))
      .body;
    const response = await agent
      .put(`/api/sites/${created.id}/engineers`)
      .set('x-csrf-token', csrfToken)
      .send({ userIds: [office.userId] });
    expect(response.status).toBe(400);
    expect(response.body.errors[0].message).toBe('Only engineers of this company can be assigned.');
  });

  it('invites a new homeowner by e-mail with a link to choose a password, and links an existing one', async () => {
    const { agent, csrfToken } = await asOffice();
    const created = (await agent.post('/api/sites').set('x-csrf-token', csrfToken).send(newSite()))
      .body;
    const invited = await agent
      .post(`/api/sites/${created.id}/homeowners`)
      .set('x-csrf-token', csrfToken)
      .send({ displayName: 'Ada Okonjo', email: 'Ada.Okonjo@Example.com' });
    expect(invited.status).toBe(201);
    expect(invited.body.homeowners).toEqual([
      expect.objectContaining({ displayName: 'Ada Okonjo', email: 'ada.okonjo@example.com' }),
    ]);
    const mail = await harness.mailbox.waitFor((m) => m.to.includes('ada.okonjo@example.com'));
    expect(mail.subject).toBe('You are invited to Wardbook');
    expect(mail.text).toMatch(/\/password\/reset\/[A-Za-z0-9_-]{43}/);
    const user = await db('users').where({ email: 'ada.okonjo@example.com' }).first();
    expect(await db('memberships').where({ user_id: user.id })).toEqual([
      expect.objectContaining({ role: 'homeowner', organisation_id: null }),
    ]);

    // A second site for the same person: linked, no second account, told rather than invited.
    const another = (
      await agent
        .post('/api/sites')
        .set('x-csrf-token', csrfToken)
        .send(newSite({ name: 'Holiday let' }))
    ).body;
    await agent
      .post(`/api/sites/${another.id}/homeowners`)
      .set('x-csrf-token', csrfToken)
      .send({ displayName: 'Ada Okonjo', email: 'ada.okonjo@example.com' });
    expect(await db('users').where({ email: 'ada.okonjo@example.com' }).count('* as n')).toEqual([
      { n: 1 },
    ]);

    const removed = await agent
      .delete(`/api/sites/${created.id}/homeowners/${user.id}`)
      .set('x-csrf-token', csrfToken);
    expect(removed.body.homeowners).toEqual([]);
  });

  it('lists the monitoring centres for the site form', async () => {
    const { agent } = await asOffice();
    const response = await agent.get('/api/monitoring-centres');
    expect(response.body.monitoringCentres).toEqual(
      expect.arrayContaining([{ id: centre.id, name: 'Sites Test Centre' }]),
    );
  });
});
