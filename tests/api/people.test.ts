import { beforeAll, describe, expect, it } from 'vitest';
import { createPerson } from '../setup/factories';
import { useSiteWorld, type SiteWorld } from '../setup/site-fixtures';

const { harness, db, world: currentWorld } = await useSiteWorld();
let world: SiteWorld;
beforeAll(() => {
  world = currentWorld();
});

const asHomeowner = () => harness.signedInAs(world.homeowner.userId);
const keyholdersOf = (siteId: string) => `/api/sites/${siteId}/keyholders`;

describe('the call plan', () => {
  it('lets the homeowner add keyholders in order, with phones written any UK way', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const added = await agent
      .post(keyholdersOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({
        name: 'Ruth Pelham',
        phone: '07700 900456',
        email: 'Ruth@Example.com',
        relation: 'Neighbour',
        minutesToAttend: 15,
      });
    expect(added.status).toBe(201);
    expect(added.body).toMatchObject({
      callOrder: 2,
      phone: '+447700900456',
      email: 'ruth@example.com',
      hasAccount: false,
      version: 1,
    });
    const again = await agent
      .post(keyholdersOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ name: 'Dev Okonjo', phone: '+44 (0)7700 900457', minutesToAttend: 25 });
    expect(again.body).toMatchObject({ callOrder: 3, phone: '+447700900457' });
  });

  it('refuses a bad phone, e-mail, attend time or date range with field errors', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const response = await agent
      .post(keyholdersOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({
        name: '',
        phone: '12345',
        email: 'not-an-email',
        minutesToAttend: 0,
        unavailable: [{ from: '2026-12-24', to: '2026-12-20' }],
      });
    expect(response.status).toBe(400);
    const byPath = Object.fromEntries(
      response.body.errors.map((e: { path: string; message: string }) => [e.path, e.message]),
    );
    expect(byPath).toMatchObject({
      'body.name': 'Name is required.',
      'body.phone': 'Enter a phone number such as 07700 900123 or +44 7700 900123.',
      'body.email': 'Enter an e-mail address such as name@example.com.',
      'body.minutesToAttend': 'At least 1 minute.',
      'body.unavailable.0.to': 'The end date is before the start.',
    });
  });

  it('reorders the whole plan at once, and refuses an order made from a stale list', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const before = (await agent.get(keyholdersOf(world.own.siteId))).body.keyholders as {
      id: string;
      name: string;
    }[];
    const reversed = [...before].reverse().map((k) => k.id);
    const reordered = await agent
      .put(`${keyholdersOf(world.own.siteId)}/order`)
      .set('x-csrf-token', csrfToken)
      .send({ keyholderIds: reversed });
    expect(reordered.status).toBe(200);
    expect(
      reordered.body.keyholders.map((k: { id: string; callOrder: number }) => [k.id, k.callOrder]),
    ).toEqual(reversed.map((id, index) => [id, index + 1]));
    const stale = await agent
      .put(`${keyholdersOf(world.own.siteId)}/order`)
      .set('x-csrf-token', csrfToken)
      .send({ keyholderIds: reversed.slice(1) });
    expect(stale.status).toBe(409);
    const audit = await db('audit_log')
      .where({ entity_id: world.own.siteId, action: 'keyholder.reordered' })
      .first();
    expect(audit.changes.callOrder.to).toEqual([...before].reverse().map((k) => k.name));
  });

  it('edits at a version, closes the gap when someone is removed, and records a confirmation', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const list = (await agent.get(keyholdersOf(world.own.siteId))).body.keyholders as {
      id: string;
      version: number;
      name: string;
    }[];
    const edited = await agent
      .patch(`${keyholdersOf(world.own.siteId)}/${list[0]!.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ minutesToAttend: 8, version: list[0]!.version });
    expect(edited.body).toMatchObject({
      minutesToAttend: 8,
      version: list[0]!.version + 1,
      name: list[0]!.name,
    });
    const stale = await agent
      .patch(`${keyholdersOf(world.own.siteId)}/${list[0]!.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ minutesToAttend: 9, version: list[0]!.version });
    expect(stale.status).toBe(409);

    const removed = await agent
      .delete(`${keyholdersOf(world.own.siteId)}/${list[0]!.id}`)
      .set('x-csrf-token', csrfToken);
    expect(removed.status).toBe(204);
    const after = (await agent.get(keyholdersOf(world.own.siteId))).body.keyholders;
    expect(after.map((k: { callOrder: number }) => k.callOrder)).toEqual(
      after.map((_: unknown, i: number) => i + 1),
    );

    const confirmed = await agent
      .post(`${keyholdersOf(world.own.siteId)}/${after[0].id}/confirm`)
      .set('x-csrf-token', csrfToken);
    expect(Date.now() - Date.parse(confirmed.body.lastConfirmedAt)).toBeLessThan(60_000);
  });

  it('keeps phone numbers out of the audit log', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const [first] = (await agent.get(keyholdersOf(world.own.siteId))).body.keyholders;
    await agent
      .patch(`${keyholdersOf(world.own.siteId)}/${first.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ phone: '07700 900777', version: first.version });
    const entry = await db('audit_log')
      .where({ entity_id: first.id, action: 'keyholder.updated' })
      .orderBy('id', 'desc')
      .first();
    expect(entry.changes.phone).toEqual({ from: '(changed)', to: '(changed)' });
    expect(JSON.stringify(entry)).not.toContain('900777');
  });

  it('invites a keyholder, who then sees the site in their own view', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const added = await agent
      .post(keyholdersOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({
        name: 'Marta Varga',
        phone: '07700 900458',
        email: 'marta.varga@example.com',
        minutesToAttend: 12,
      });
    const invited = await agent
      .post(`${keyholdersOf(world.own.siteId)}/${added.body.id}/invitation`)
      .set('x-csrf-token', csrfToken);
    expect(invited.status).toBe(202);
    const mail = await harness.mailbox.waitFor((m) => m.to.includes('marta.varga@example.com'));
    expect(mail.text).toContain('hold keys for');
    expect(mail.text).not.toMatch(/Test Street/); // no full address in the invitation

    const marta = await db('users').where({ email: 'marta.varga@example.com' }).first();
    const keyholderView = await harness.signedInAs(marta.id);
    const own = await keyholderView.agent.get('/api/my/keyholdings');
    expect(own.body.keyholdings).toHaveLength(1);
    expect((await keyholderView.agent.get(`/api/sites/${world.own.siteId}/zones`)).status).toBe(
      403,
    );

    const noEmail = await agent
      .post(keyholdersOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ name: 'No Email', phone: '07700 900459', minutesToAttend: 12 });
    const refused = await agent
      .post(`${keyholdersOf(world.own.siteId)}/${noEmail.body.id}/invitation`)
      .set('x-csrf-token', csrfToken);
    expect(refused.status).toBe(400);
  });

  it("does not let one homeowner touch another's call plan", async () => {
    const { agent, csrfToken } = await asHomeowner();
    const response = await agent
      .post(keyholdersOf(world.other.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ name: 'Intruder', phone: '07700 900460', minutesToAttend: 5 });
    expect(response.status).toBe(404);
    expect(await db('keyholders').where({ name: 'Intruder' })).toEqual([]);
  });
});

describe('user-code slots', () => {
  const slotsOf = (siteId: string) => `/api/sites/${siteId}/user-slots`;

  it('records who holds a slot, never a code', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const added = await agent
      .post(slotsOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({
        slot: 5,
        holderName: 'Cleaner',
        accessLevel: 2,
        areaNumbers: [1],
        validFrom: '2026-12-01',
        validTo: '2027-03-31',
      });
    expect(added.status).toBe(201);
    expect(added.body).toMatchObject({
      slot: 5,
      holderName: 'Cleaner',
      accessLevel: 2,
      active: true,
      validTo: '2027-03-31',
    });
    expect(added.body.changedBy).toBe(world.homeowner.displayName);
    const columns = Object.keys(await db('user_code_slots').columnInfo());
    expect(columns.filter((column) => /code|pin|pass/.test(column))).toEqual([]);
  });

  it.each([
    ['code', { slot: 6, holderName: 'Gardener', accessLevel: 2, code: '1234' }],
    ['pin', { slot: 6, holderName: 'Gardener', accessLevel: 2, pin: '9876' }],
    ['userCode', { slot: 6, holderName: 'Gardener', accessLevel: 2, userCode: '4321' }],
  ])('refuses a body carrying a %s field, and says why', async (field, body) => {
    const { agent, csrfToken } = await asHomeowner();
    const response = await agent
      .post(slotsOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send(body);
    expect(response.status).toBe(400);
    expect(response.body).toMatchObject({
      type: '/problems/user-code-refused',
      errors: [{ path: `body.${field}`, message: 'Remove this: Wardbook does not take codes.' }],
    });
    expect(await db('user_code_slots').where({ site_id: world.own.siteId, slot: 6 })).toEqual([]);
  });

  it('refuses codes hidden deeper in any site body too', async () => {
    const { agent, csrfToken } = await harness.signedInAs(world.office.userId);
    const response = await agent
      .post(`/api/sites/${world.own.siteId}/keyholders`)
      .set('x-csrf-token', csrfToken)
      .send({
        name: 'Sneaky',
        phone: '07700 900461',
        minutesToAttend: 5,
        unavailable: [{ from: '2027-01-01', to: '2027-01-02', PIN: '0000' }],
      });
    expect(response.status).toBe(400);
    expect(response.body.errors[0].path).toBe('body.unavailable.0.PIN');
  });

  it('keeps the engineer level for the installer, and lets the homeowner deactivate a slot', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const level3 = await agent
      .post(slotsOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ slot: 7, holderName: 'Me as engineer', accessLevel: 3 });
    expect(level3.status).toBe(400);
    expect(level3.body.errors[0].path).toBe('body.accessLevel');

    const slot = (await agent.get(slotsOf(world.own.siteId))).body.slots.find(
      (s: { slot: number }) => s.slot === 5,
    );
    const deactivated = await agent
      .patch(`${slotsOf(world.own.siteId)}/${slot.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ active: false, version: slot.version });
    expect(deactivated.body).toMatchObject({ active: false, version: slot.version + 1 });
    const raise = await agent
      .patch(`${slotsOf(world.own.siteId)}/${slot.id}`)
      .set('x-csrf-token', csrfToken)
      .send({ accessLevel: 3, version: slot.version + 1 });
    expect(raise.status).toBe(400);
    expect(
      (await agent.delete(`${slotsOf(world.own.siteId)}/${slot.id}`).set('x-csrf-token', csrfToken))
        .status,
    ).toBe(403);
  });

  it('refuses a duplicate slot number and an end date before the start', async () => {
    const { agent, csrfToken } = await harness.signedInAs(world.engineer.userId);
    const duplicate = await agent
      .post(slotsOf(world.own.siteId))
      .set('x-csrf-token', csrfToken)
      .send({ slot: 2, holderName: 'Another', accessLevel: 2 });
    expect(duplicate.status).toBe(400);
    expect(duplicate.body.errors[0]).toEqual({
      path: 'body.slot',
      message: 'Slot 2 is already recorded.',
    });
    const dates = await agent.post(slotsOf(world.own.siteId)).set('x-csrf-token', csrfToken).send({
      slot: 8,
      holderName: 'Temp',
      accessLevel: 2,
      validFrom: '2027-02-01',
      validTo: '2027-01-01',
    });
    expect(dates.body.errors[0].path).toBe('body.validTo');
  });
});

describe('change requests', () => {
  it('lets the homeowner ask and the installer answer', async () => {
    const { agent, csrfToken } = await asHomeowner();
    const asked = await agent
      .post(`/api/sites/${world.own.siteId}/change-requests`)
      .set('x-csrf-token', csrfToken)
      .send({ subject: 'Add a detector', details: 'The new garden room needs covering.' });
    expect(asked.status).toBe(201);
    expect(asked.body).toMatchObject({ status: 'open', requestedBy: world.homeowner.displayName });

    const office = await harness.signedInAs(world.office.userId);
    const closed = await office.agent
      .patch(`/api/sites/${world.own.siteId}/change-requests/${asked.body.id}`)
      .set('x-csrf-token', office.csrfToken)
      .send({ status: 'closed' });
    expect(closed.body.status).toBe('closed');
    const list = (await agent.get(`/api/sites/${world.own.siteId}/change-requests`)).body
      .changeRequests;
    expect(list.find((r: { id: string }) => r.id === asked.body.id).status).toBe('closed');
  });
});

describe('homeowner and keyholder views', () => {
  it("give the homeowner their homes with who to call, and nobody else's", async () => {
    await db('organisations')
      .where({ id: world.installer.id })
      .update({ phone: '+441632960111', out_of_hours_phone: '+441632960112' });
    const { agent } = await asHomeowner();
    const { body } = await agent.get('/api/my/homes');
    expect(body.homes.map((home: { id: string }) => home.id)).toEqual([world.own.siteId]);
    expect(body.homes[0].installer).toMatchObject({
      phone: '+441632960111',
      outOfHoursPhone: '+441632960112',
    });
    expect(body.homes[0].monitoringCentre).toMatchObject({ name: world.centre.name });
    expect((await agent.get(`/api/my/homes/${world.other.siteId}`)).status).toBe(404);
  });

  it('give the keyholder only what a keyholder needs', async () => {
    await db('sites')
      .where({ id: world.own.siteId })
      .update({ hazards: 'Dog in the kitchen.', access_notes: 'Side gate.' });
    const { agent } = await harness.signedInAs(world.keyholder.userId);
    const { body } = await agent.get('/api/my/keyholdings');
    expect(body.keyholdings).toHaveLength(1);
    const [holding] = body.keyholdings;
    expect(Object.keys(holding).sort()).toEqual(
      [
        'siteId',
        'keyholderId',
        'siteName',
        'address',
        'accessNotes',
        'hazards',
        'callOrder',
        'keyholderCount',
        'minutesToAttend',
        'monitoringCentre',
      ].sort(),
    );
    expect(holding).toMatchObject({ hazards: 'Dog in the kitchen.', accessNotes: 'Side gate.' });
    for (const path of ['zones', 'user-slots', 'files', 'keyholders', 'system']) {
      const response = await agent.get(`/api/sites/${world.own.siteId}/${path}`);
      expect([403], path).toContain(response.status);
    }
  });

  it('do not give a person without the role anything', async () => {
    const nobody = await createPerson(db, { memberships: [{ role: 'homeowner' }] });
    const { agent } = await harness.signedInAs(nobody.userId);
    expect((await agent.get('/api/my/homes')).body.homes).toEqual([]);
    expect((await agent.get('/api/my/keyholdings')).status).toBe(403);
  });
});
