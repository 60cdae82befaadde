import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApiHarness } from '../setup/api-app';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation, createPerson, type TestPerson } from '../setup/factories';

const db = testDb();
const harness = await buildApiHarness(db);
let engineer: TestPerson;
let installerId: string;

beforeAll(async () => {
  installerId = (await createOrganisation(db, 'installer')).id;
  engineer = await createPerson(db, {
    memberships: [{ role: 'engineer', organisationId: installerId }],
  });
});
afterAll(async () => {
  await harness.close();
  await closeTestDb();
});

async function freshSite() {
  const { agent, csrfToken } = await harness.signedInAs(engineer.userId);
  const site = await agent.post('/api/sites').set('x-csrf-token', csrfToken).send({
    name: 'Schedule test',
    premisesType: 'domestic',
    addressLine1: '3 Saltings Way',
    town: 'Eastmere',
    postcode: 'EM2 3AB',
    requiredGrade: 2,
    environmentalClass: 2,
  });
  return { agent, csrfToken, siteId: site.body.id as string };
}

const zone = (number: number, overrides: Record<string, unknown> = {}) => ({
  number,
  location: `Room ${number}`,
  zoneType: number === 1 ? 'entry_exit' : 'instant',
  detectorKind: 'dual_technology',
  loopWiring: 'two_resistor',
  tamperOhms: 2200,
  alarmOhms: 4700,
  coreMap: [
    { colour: 'red', terminal: '+12V' },
    { colour: 'black', terminal: '0V' },
    { colour: 'white', terminal: `Z${number}` },
    { colour: 'yellow', terminal: `Z${number}` },
  ],
  quiescentMa: 15,
  alarmMa: 25,
  ...overrides,
});

async function recordSystem(
  agent: Awaited<ReturnType<typeof freshSite>>['agent'],
  csrfToken: string,
  siteId: string,
) {
  return agent
    .put(`/api/sites/${siteId}/system`)
    .set('x-csrf-token', csrfToken)
    .send({
      controlPanel: 'Hybrid 16-zone panel',
      firmware: '4.2.1',
      panelLocation: 'Under the stairs',
      psuType: 'A',
      batteryAh: 7,
      notification: 'C',
      mainsFailureSignalled: true,
      signallingPaths: [
        { bearer: 'ip', atsCategory: 'dp2', description: 'Router' },
        { bearer: 'cellular', atsCategory: 'DP2' },
      ],
      areas: [
        { number: 1, name: 'Downstairs' },
        { number: 2, name: 'Upstairs' },
      ],
      version: null,
    });
}

describe('the system record', () => {
  it('records the panel, power, signalling paths in order and areas', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    expect((await agent.get(`/api/sites/${siteId}/system`)).body).toEqual({ system: null });
    const saved = await recordSystem(agent, csrfToken, siteId);
    expect(saved.status).toBe(200);
    expect(saved.body.system).toMatchObject({
      controlPanel: 'Hybrid 16-zone panel',
      psuType: 'A',
      batteryAh: 7,
      signallingPaths: [
        { position: 1, bearer: 'ip', atsCategory: 'DP2' },
        { position: 2, bearer: 'cellular', atsCategory: 'DP2' },
      ],
      areas: [
        { number: 1, name: 'Downstairs' },
        { number: 2, name: 'Upstairs' },
      ],
      version: 1,
    });
  });

  it('keeps area ids across edits and refuses a second "first" recording', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    const first = (await recordSystem(agent, csrfToken, siteId)).body.system;
    const again = await recordSystem(agent, csrfToken, siteId);
    expect(again.status).toBe(409);
    const renamed = await agent
      .put(`/api/sites/${siteId}/system`)
      .set('x-csrf-token', csrfToken)
      .send({
        controlPanel: 'Hybrid 16-zone panel',
        areas: [
          { id: first.areas[1].id, number: 1, name: 'Upstairs' },
          { id: first.areas[0].id, number: 2, name: 'Downstairs' },
        ],
        version: first.version,
      });
    expect(renamed.status).toBe(200);
    expect(renamed.body.system.areas).toEqual([
      { id: first.areas[1].id, number: 1, name: 'Upstairs' },
      { id: first.areas[0].id, number: 2, name: 'Downstairs' },
    ]);
  });

  it('refuses a battery on a type C supply, duplicate areas and absurd capacities', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    const response = await agent
      .put(`/api/sites/${siteId}/system`)
      .set('x-csrf-token', csrfToken)
      .send({
        psuType: 'C',
        batteryAh: 7,
        areas: [
          { number: 1, name: 'A' },
          { number: 1, name: 'B' },
        ],
        version: null,
      });
    expect(response.status).toBe(400);
    expect(response.body.errors.map((e: { path: string }) => e.path).sort()).toEqual([
      'body.areas.1.number',
      'body.batteryAh',
    ]);
    const absurd = await agent
      .put(`/api/sites/${siteId}/system`)
      .set('x-csrf-token', csrfToken)
      .send({ batteryAh: 7000, version: null });
    expect(absurd.body.errors[0].path).toBe('body.batteryAh');
  });
});

describe('the zone schedule', () => {
  it('asks for the system before any zone', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    expect((await agent.get(`/api/sites/${siteId}/zones`)).body).toEqual({
      zonesVersion: null,
      areas: [],
      zones: [],
    });
    const response = await agent
      .put(`/api/sites/${siteId}/zones`)
      .set('x-csrf-token', csrfToken)
      .send({ zonesVersion: 1, zones: [zone(1)] });
    expect(response.status).toBe(409);
    expect(response.body.detail).toMatch(/System tab/);
  });

  it('saves eight zones in order, then reorders, edits and removes while keeping ids', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    const system = (await recordSystem(agent, csrfToken, siteId)).body.system;
    const eight = Array.from({ length: 8 }, (_, index) =>
      zone(index + 1, { areaId: system.areas[index < 4 ? 0 : 1].id }),
    );
    const saved = await agent
      .put(`/api/sites/${siteId}/zones`)
      .set('x-csrf-token', csrfToken)
      .send({ zonesVersion: 1, zones: eight });
    expect(saved.status).toBe(200);
    expect(saved.body.zonesVersion).toBe(2);
    expect(
      saved.body.zones.map((z: { number: number; position: number }) => [z.position, z.number]),
    ).toEqual(eight.map((_, index) => [index + 1, index + 1]));
    expect(saved.body.zones[0]).toMatchObject({
      tamperOhms: 2200,
      alarmOhms: 4700,
      quiescentMa: 15,
      coreMap: eight[0]!.coreMap,
    });

    const [first, second, ...rest] = saved.body.zones;
    // Swap zone numbers 1 and 2, move zone 2 to the top, drop the last zone.
    const edited = [
      { ...second, number: 1 },
      { ...first, number: 2, location: 'Front door' },
      ...rest.slice(0, -1),
    ].map(({ position: _position, ...z }: { position: number }) => z);
    const resaved = await agent
      .put(`/api/sites/${siteId}/zones`)
      .set('x-csrf-token', csrfToken)
      .send({ zonesVersion: 2, zones: edited });
    expect(resaved.status).toBe(200);
    expect(resaved.body.zones).toHaveLength(7);
    expect(resaved.body.zones[0]).toMatchObject({ id: second.id, number: 1, position: 1 });
    expect(resaved.body.zones[1]).toMatchObject({
      id: first.id,
      number: 2,
      location: 'Front door',
    });
    expect((await agent.get(`/api/sites/${siteId}`)).body.counts.zones).toBe(7);
  });

  it('points at the exact row and field of every mistake, and saves nothing', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    await recordSystem(agent, csrfToken, siteId);
    const response = await agent
      .put(`/api/sites/${siteId}/zones`)
      .set('x-csrf-token', csrfToken)
      .send({
        zonesVersion: 1,
        zones: [
          zone(1),
          zone(2, { tamperOhms: 0 }),
          zone(3, { alarmOhms: -4700 }),
          zone(1),
          zone(5, { alarmOhms: 2.2 }),
          zone(6, { tamperOhms: 47_000_000 }),
          zone(7, { loopWiring: 'closed_loop_separate_tamper' }),
          zone(8, { loopWiring: 'one_resistor', tamperOhms: null, alarmOhms: null }),
        ],
      });
    expect(response.status).toBe(400);
    const byPath = Object.fromEntries(
      response.body.errors.map((e: { path: string; message: string }) => [e.path, e.message]),
    );
    expect(byPath).toMatchObject({
      'body.zones.1.tamperOhms': 'Resistor values start at 10 Ω. Enter ohms: 2200, not 2.2.',
      'body.zones.2.alarmOhms': 'Resistor values start at 10 Ω. Enter ohms: 2200, not 2.2.',
      'body.zones.3.number': 'Zone 1 is already used in row 1.',
      'body.zones.4.alarmOhms': 'Enter whole ohms, e.g. 4700 for 4k7.',
      'body.zones.5.tamperOhms': 'That is over 100 kΩ. Enter ohms, e.g. 4700 for 4k7.',
      'body.zones.6.tamperOhms': 'A closed loop has no resistors; clear this value.',
      'body.zones.7.alarmOhms': 'A one-resistor loop needs its resistor value.',
    });
    expect((await agent.get(`/api/sites/${siteId}/zones`)).body.zones).toEqual([]);
  });

  it('refuses a stale schedule and an area from another system', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    await recordSystem(agent, csrfToken, siteId);
    await agent
      .put(`/api/sites/${siteId}/zones`)
      .set('x-csrf-token', csrfToken)
      .send({ zonesVersion: 1, zones: [zone(1)] });
    const stale = await agent
      .put(`/api/sites/${siteId}/zones`)
      .set('x-csrf-token', csrfToken)
      .send({ zonesVersion: 1, zones: [zone(1), zone(2)] });
    expect(stale.status).toBe(409);

    const elsewhere = await freshSite();
    const foreignArea = (await recordSystem(elsewhere.agent, elsewhere.csrfToken, elsewhere.siteId))
      .body.system.areas[0].id;
    const foreign = await agent
      .put(`/api/sites/${siteId}/zones`)
      .set('x-csrf-token', csrfToken)
      .send({ zonesVersion: 2, zones: [zone(1, { areaId: foreignArea })] });
    expect(foreign.status).toBe(400);
    expect(foreign.body.errors[0]).toEqual({
      path: 'body.zones.0.areaId',
      message: 'Choose one of this system’s areas.',
    });
    expect((await agent.get(`/api/sites/${siteId}/zones`)).body.zones).toHaveLength(1);
  });
});

describe('the device list', () => {
  it('saves devices in order with their currents', async () => {
    const { agent, csrfToken, siteId } = await freshSite();
    await recordSystem(agent, csrfToken, siteId);
    const saved = await agent
      .put(`/api/sites/${siteId}/devices`)
      .set('x-csrf-token', csrfToken)
      .send({
        devicesVersion: 1,
        devices: [
          { kind: 'keypad', location: 'Hall', quiescentMa: 40, alarmMa: 60, grade: 2 },
          {
            kind: 'external_sounder',
            location: 'Front elevation',
            quiescentMa: 25,
            alarmMa: 450,
            environmentalClass: 4,
          },
        ],
      });
    expect(saved.status).toBe(200);
    expect(
      saved.body.devices.map((d: { kind: string; alarmMa: number }) => [d.kind, d.alarmMa]),
    ).toEqual([
      ['keypad', 60],
      ['external_sounder', 450],
    ]);
    const bad = await agent
      .put(`/api/sites/${siteId}/devices`)
      .set('x-csrf-token', csrfToken)
      .send({ devicesVersion: 2, devices: [{ kind: 'toaster', location: '', quiescentMa: -1 }] });
    expect(bad.status).toBe(400);
    expect(bad.body.errors.map((e: { path: string }) => e.path).sort()).toEqual([
      'body.devices.0.kind',
      'body.devices.0.location',
      'body.devices.0.quiescentMa',
    ]);
  });
});
