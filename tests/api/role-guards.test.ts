import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROLES, type Role } from '../../server/users/roles';
import { buildApiHarness } from '../setup/api-app';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation, createPerson, type TestPerson } from '../setup/factories';

const db = testDb();
const harness = await buildApiHarness(db);
const people = {} as Record<Role, TestPerson>;
let installer: { id: string; name: string };
let rivalInstaller: { id: string; name: string };
let centre: { id: string; name: string };
let rivalOffice: TestPerson;

beforeAll(async () => {
  installer = await createOrganisation(db, 'installer');
  rivalInstaller = await createOrganisation(db, 'installer');
  centre = await createOrganisation(db, 'monitoring_centre');
  const organisationFor: Record<Role, string | undefined> = {
    engineer: installer.id,
    office: installer.id,
    operator: centre.id,
    homeowner: undefined,
    keyholder: undefined,
  };
  for (const role of ROLES) {
    people[role] = await createPerson(db, {
      memberships: [{ role, organisationId: organisationFor[role] }],
    });
  }
  rivalOffice = await createPerson(db, {
    memberships: [{ role: 'office', organisationId: rivalInstaller.id }],
  });
});

afterAll(async () => {
  await harness.close();
  await closeTestDb();
});

describe('role guards', () => {
  it.each(ROLES)('lets a %s open their own home and refuses every other role’s', async (role) => {
    const { agent } = await harness.signedInAs(people[role].userId);
    const own = await agent.get(`/api/homes/${role}`);
    expect(own.status).toBe(200);
    expect(own.body.role).toBe(role);
    for (const other of ROLES.filter((r) => r !== role)) {
      const refused = await agent.get(`/api/homes/${other}`);
      expect(refused.status, `${role} asking for ${other}`).toBe(403);
      expect(refused.headers['content-type']).toMatch(/application\/problem\+json/);
      expect(refused.body.type).toBe('/problems/forbidden');
    }
  });

  it('rejects an unknown role name as a validation problem', async () => {
    const { agent } = await harness.signedInAs(people.office.userId);
    const response = await agent.get('/api/homes/superuser');
    expect(response.status).toBe(400);
    expect(response.body.errors[0].path).toBe('params.role');
  });

  it('refuses every role API to someone not signed in', async () => {
    const { agent } = await harness.signedInAs(people.engineer.userId);
    await agent
      .post('/auth/logout')
      .set('x-csrf-token', (await agent.get('/api/me')).body.csrfToken);
    for (const role of ROLES) {
      const response = await agent.get(`/api/homes/${role}`);
      expect(response.status).toBe(401);
    }
  });
});

describe('organisation scope', () => {
  it("shows the office only its own organisation's people and audit entries", async () => {
    const { agent } = await harness.signedInAs(people.office.userId);
    const home = await agent.get('/api/homes/office');
    expect(home.status).toBe(200);
    expect(home.body.organisation).toEqual({
      id: installer.id,
      name: installer.name,
      kind: 'installer',
    });
    const emails = home.body.members.map((m: { email: string }) => m.email);
    expect(emails).toEqual(expect.arrayContaining([people.office.email, people.engineer.email]));
    expect(emails).not.toContain(rivalOffice.email);
    expect(emails).not.toContain(people.operator.email);
  });

  it("never shows a rival installer's office this installer's people", async () => {
    const { agent } = await harness.signedInAs(rivalOffice.userId);
    const home = await agent.get('/api/homes/office');
    const emails = home.body.members.map((m: { email: string }) => m.email);
    expect(emails).toEqual([rivalOffice.email]);
    for (const entry of home.body.recentAudit as { summary: string }[]) {
      expect(entry.summary).not.toContain(people.engineer.email);
    }
  });

  it('shows operators their centre and its operators only', async () => {
    const { agent } = await harness.signedInAs(people.operator.userId);
    const home = await agent.get('/api/homes/operator');
    expect(home.body.organisation.id).toBe(centre.id);
    expect(home.body.operators.map((o: { email: string }) => o.email)).toEqual([
      people.operator.email,
    ]);
  });

  it('gives a person with two roles both homes, and each only its own data', async () => {
    const both = await createPerson(db, {
      memberships: [{ role: 'homeowner' }, { role: 'keyholder' }],
    });
    const { agent } = await harness.signedInAs(both.userId);
    const me = await agent.get('/api/me');
    expect(me.body.roles.map((r: { role: string }) => r.role).sort()).toEqual([
      'homeowner',
      'keyholder',
    ]);
    expect((await agent.get('/api/homes/homeowner')).status).toBe(200);
    expect((await agent.get('/api/homes/keyholder')).status).toBe(200);
    expect((await agent.get('/api/homes/engineer')).status).toBe(403);
  });

  it('treats an expired session as signed out', async () => {
    const person = await createPerson(db, { memberships: [{ role: 'homeowner' }] });
    const { agent } = await harness.signedInAs(person.userId);
    expect((await agent.get('/api/me')).status).toBe(200);
    await db('sessions')
      .whereRaw(`sess->>'userId' = ?`, [person.userId])
      .update({ expire: db.raw(`now() - interval '1 minute'`) });
    const response = await agent.get('/api/me');
    expect(response.status).toBe(401);
    expect(response.body.type).toBe('/problems/not-signed-in');
  });

  it('signs out a disabled user on their next request', async () => {
    const leaver = await createPerson(db, {
      memberships: [{ role: 'engineer', organisationId: installer.id }],
    });
    const { agent } = await harness.signedInAs(leaver.userId);
    expect((await agent.get('/api/me')).status).toBe(200);
    await db('users').where({ id: leaver.userId }).update({ disabled_at: db.fn.now() });
    expect((await agent.get('/api/me')).status).toBe(401);
  });
});

describe('organisation routes', () => {
  it('give staff their own organisation and hide every other one behind a 404', async () => {
    const { agent } = await harness.signedInAs(people.engineer.userId);
    const own = await agent.get(`/api/organisations/${installer.id}`);
    expect(own.status).toBe(200);
    expect(own.body.organisation).toEqual({
      id: installer.id,
      name: installer.name,
      kind: 'installer',
    });
    expect(own.body.membersByRole).toEqual({ engineer: 1, office: 1 });
    for (const other of [
      rivalInstaller.id,
      centre.id,
      '00000000-0000-4000-8000-000000000000',
      'not-a-uuid',
    ]) {
      const refused = await agent.get(`/api/organisations/${other}`);
      expect(refused.status, other).toBe(404);
      expect(refused.body.type).toBe('/problems/not-found');
    }
  });

  it('refuse organisation routes to homeowners and keyholders by role', async () => {
    for (const role of ['homeowner', 'keyholder'] as const) {
      const { agent } = await harness.signedInAs(people[role].userId);
      expect((await agent.get(`/api/organisations/${installer.id}`)).status).toBe(403);
      expect((await agent.get(`/api/organisations/${installer.id}/members`)).status).toBe(403);
    }
  });

  it('let only the office read the audit log, one page at a time', async () => {
    const engineer = await harness.signedInAs(people.engineer.userId);
    expect((await engineer.agent.get(`/api/organisations/${installer.id}/audit`)).status).toBe(403);

    const { agent } = await harness.signedInAs(people.office.userId);
    for (let i = 0; i < 3; i++) {
      await db('audit_log').insert({
        action: 'test.note',
        organisation_id: installer.id,
        summary: `note ${i}`,
      });
    }
    const first = await agent.get(`/api/organisations/${installer.id}/audit?limit=2`);
    expect(first.status).toBe(200);
    expect(first.body.entries.map((e: { summary: string }) => e.summary)).toEqual([
      'note 2',
      'note 1',
    ]);
    const second = await agent.get(
      `/api/organisations/${installer.id}/audit?limit=2&before=${first.body.nextBefore}`,
    );
    expect(second.body.entries[0].summary).toBe('note 0');

    const bad = await agent.get(`/api/organisations/${installer.id}/audit?limit=0`);
    expect(bad.status).toBe(400);
    expect(bad.body.errors).toEqual([{ path: 'query.limit', message: expect.any(String) }]);

    const rival = await harness.signedInAs(rivalOffice.userId);
    expect((await rival.agent.get(`/api/organisations/${installer.id}/audit`)).status).toBe(404);
  });

  it("let an operator list their centre's people but not an installer's", async () => {
    const { agent } = await harness.signedInAs(people.operator.userId);
    expect((await agent.get(`/api/organisations/${centre.id}/members`)).status).toBe(200);
    expect((await agent.get(`/api/organisations/${installer.id}/members`)).status).toBe(404);
  });
});

describe('database guards', () => {
  it('refuses an engineer membership in a monitoring centre', async () => {
    const person = await createPerson(db, { memberships: [] });
    await expect(
      db('memberships').insert({
        user_id: person.userId,
        role: 'engineer',
        organisation_id: centre.id,
      }),
    ).rejects.toThrow(/does not belong in a monitoring_centre/);
  });

  it('keeps the audit log append-only', async () => {
    await expect(db('audit_log').update({ summary: 'rewritten' })).rejects.toThrow(/append-only/);
    await expect(db('audit_log').delete()).rejects.toThrow(/append-only/);
  });
});
