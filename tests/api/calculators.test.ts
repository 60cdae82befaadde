import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildApiHarness } from '../setup/api-app';
import { closeTestDb, testDb } from '../setup/database';
import { createOrganisation, createPerson, type TestPerson } from '../setup/factories';

const db = testDb();
const harness = await buildApiHarness(db);
let engineer: TestPerson;

beforeAll(async () => {
  const installer = await createOrganisation(db, 'installer');
  engineer = await createPerson(db, {
    memberships: [{ role: 'engineer', organisationId: installer.id }],
  });
});
afterAll(async () => {
  await harness.close();
  await closeTestDb();
});

async function post(path: string, body: unknown) {
  const { agent, csrfToken } = await harness.signedInAs(engineer.userId);
  return agent
    .post(path)
    .set('x-csrf-token', csrfToken)
    .send(body as object);
}

describe('resistor value calculator', () => {
  // 2.2 kΩ = red-red-red-gold (IEC 60062, ../shared/checks.md); 2200 is an E12 value (IEC 60063).
  it('reads 2K2 and gives its code, preferred values and colour bands', async () => {
    const response = await post('/api/calc/resistance', { value: '2K2' });
    expect(response.status).toBe(200);
    expect(response.body).toEqual({
      ohms: 2200,
      code: '2K2',
      spoken: '2.2 kΩ',
      e12: { nearest: 2200, isPreferred: true },
      e24: { nearest: 2200, isPreferred: true },
      fourBands: ['red', 'red', 'red', 'gold'],
      fiveBands: ['red', 'red', 'black', 'brown', 'brown'],
    });
  });

  it.each([
    ['2.2', /ambiguous/],
    ['-100', /negative/],
    ['', /Enter a resistance/],
    ['0', /more than 0 Ω/],
    ['fourK7', /is not a resistance/],
  ])('refuses %j with a field error naming the accepted forms', async (value, message) => {
    const response = await post('/api/calc/resistance', { value });
    expect(response.status).toBe(400);
    expect(response.body.errors[0]).toEqual({
      path: 'body.value',
      message: expect.stringMatching(message),
    });
  });
});

describe('loop calculator', () => {
  // Two-resistor loop 2k2/4k7: 2.2 kΩ secure, 6.9 kΩ in alarm (common practice, no source).
  it('gives the bands for a 2k2 / 4k7 loop over 100 m of 7/0.2 and classifies a reading', async () => {
    const response = await post('/api/calc/loop', {
      wiring: 'two_resistor',
      tamperOhms: '2k2',
      alarmOhms: '4k7',
      tolerance: 0.05,
      cable: { core: '7/0.2', runMetres: 100 },
      reading: '2.22 kΩ',
    });
    expect(response.status).toBe(200);
    // 100 m out and back of 7/0.2 ≈ 15.7 Ω (IEC 60028, ../shared/checks.md).
    expect(response.body.cableOhms).toBeCloseTo(15.68, 2);
    const normal = response.body.bands.find((band: { state: string }) => band.state === 'normal');
    const alarm = response.body.bands.find((band: { state: string }) => band.state === 'alarm');
    const open = response.body.bands.find(
      (band: { state: string }) => band.state === 'open_circuit',
    );
    expect(normal.nominalOhms).toBeCloseTo(2215.68, 2);
    expect(alarm.nominalOhms).toBeCloseTo(6915.68, 2);
    expect(open).toMatchObject({ highOhms: null, nominalOhms: null });
    expect(response.body.problems).toEqual([]);
    expect(response.body.classification).toMatchObject({ state: 'normal', band: 'normal' });
  });

  it('reads an OL reading as open circuit and reports overlapping pairs', async () => {
    const open = await post('/api/calc/loop', {
      wiring: 'two_resistor',
      tamperOhms: 2200,
      alarmOhms: 4700,
      reading: 'OL',
    });
    expect(open.body.classification).toMatchObject({ state: 'open_circuit', marginOhms: null });
    const overlap = await post('/api/calc/loop', {
      wiring: 'two_resistor',
      tamperOhms: '10k',
      alarmOhms: '220R',
    });
    expect(overlap.body.problems[0]).toMatch(/overlap/);
  });

  it('asks for the resistors the wiring needs', async () => {
    const response = await post('/api/calc/loop', { wiring: 'two_resistor', alarmOhms: '4k7' });
    expect(response.status).toBe(400);
    expect(response.body.errors[0].path).toBe('body.tamperOhms');
  });
});

describe('cable calculator', () => {
  it('gives ohms per metre, the volts at the detector and the longest run', async () => {
    // IEC 60028 copper: 7/0.2 is 0.0784 Ω/m at 20 °C; 100 m at 30 mA drops 0.47 V from 13.7 V.
    const response = await post('/api/calc/cable', {
      core: '7/0.2',
      runMetres: 100,
      currentMa: 30,
      supplyVolts: 13.7,
      minimumVolts: 9,
    });
    expect(response.status).toBe(200);
    expect(response.body.ohmsPerMetre).toBeCloseTo(0.0784, 4);
    expect(response.body.voltsAtDetector).toBeCloseTo(13.23, 2);
    expect(response.body.longestRunMetres).toBeCloseTo(
      4.7 / (2 * 0.03 * response.body.ohmsPerMetre),
      3,
    );
  });

  it('needs the core build or its area, not both', async () => {
    const response = await post('/api/calc/cable', {
      core: '7/0.2',
      areaMm2: 0.22,
      runMetres: 10,
      currentMa: 10,
    });
    expect(response.status).toBe(400);
  });
});

describe('power budget calculator', () => {
  // C = (Iq × Ts + Ia × Ta) × 1.25; grade 2 type A: 12 h (EN 50131-6 from memory, ../shared/checks.md).
  it('shows the working with the numbers in it', async () => {
    const response = await post('/api/calc/power-budget', {
      items: [
        { label: 'Panel', quiescentMa: 200, alarmMa: 300 },
        { label: 'PIR', quiescentMa: 15, alarmMa: 20, count: 20 },
        { label: 'External sounder', quiescentMa: 0, alarmMa: 800 },
      ],
      grade: 2,
      psuType: 'A',
      alarmMinutes: 15,
      batteryAh: 7,
    });
    expect(response.body).toMatchObject({ standbyHours: 12, requiredAh: 7.97, passes: false });
    expect(response.body.working).toBe('(0.5 A × 12 h + 1.5 A × 0.25 h) × 1.25 = 7.97 Ah');
  });

  it('asks for the standby time of a type B supply, and refuses sounders over 20 minutes', async () => {
    const typeB = await post('/api/calc/power-budget', {
      items: [{ label: 'Panel', quiescentMa: 100, alarmMa: 100 }],
      grade: 3,
      psuType: 'B',
    });
    expect(typeB.status).toBe(400);
    expect(typeB.body.errors[0].path).toBe('body.standbyHoursOverride');
    const long = await post('/api/calc/power-budget', {
      items: [{ label: 'Panel', quiescentMa: 100, alarmMa: 100 }],
      grade: 2,
      psuType: 'A',
      alarmMinutes: 30,
    });
    expect(long.body.errors[0]).toEqual({
      path: 'body.alarmMinutes',
      message: 'External sounders must stop within 20 minutes.',
    });
  });
});

describe('grade calculator', () => {
  it('takes the lowest grade (EN 50131-1)', async () => {
    const response = await post('/api/calc/grade', {
      components: [
        { label: 'Panel', grade: 3 },
        { label: 'Keypad', grade: 2 },
      ],
    });
    expect(response.body).toEqual({ grade: 2, limitedBy: ['Keypad'], ungraded: [] });
  });
});
