import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  coreAreaMm2,
  coreOhmsPerMetre,
  longestRunMetres,
  runLoopOhms,
  SEVEN_STRAND_0_2,
  voltageAtDetector,
} from '../../server/calc/cable';
import { environmentalMismatches, systemGrade } from '../../server/calc/grade';
import { classifyReading, loopBands, type LoopDesign } from '../../server/calc/loop';
import { powerBudget, standbyHours, STANDBY_HOURS_TYPE_A } from '../../server/calc/power';
import { E24 } from '../../server/calc/preferred-values';

const twoResistor = (
  tamperOhms: number,
  alarmOhms: number,
  cable = { min: 0, max: 0 },
): LoopDesign => ({
  wiring: 'two_resistor',
  tamperOhms,
  alarmOhms,
  tolerance: 0.05,
  cableOhms: cable,
});

describe('the two-resistor loop', () => {
  // 2.2 kΩ tamper in series, 4.7 kΩ alarm across the contact: 2.2 kΩ secure, 2.2 + 4.7 =
  // 6.9 kΩ in alarm; open circuit = tamper; near zero = short (common practice, no source;
  // ../shared/checks.md).
  it('reads 2.2 kΩ secure and 6.9 kΩ in alarm for 2k2 / 4k7', () => {
    const { bands, problems } = loopBands(twoResistor(2200, 4700));
    expect(problems).toEqual([]);
    const nominal = Object.fromEntries(bands.map((band) => [band.state, band.nominalOhms]));
    expect(nominal).toMatchObject({
      normal: 2200,
      alarm: 6900,
      open_circuit: Number.POSITIVE_INFINITY,
    });
    expect(classifyReading(twoResistor(2200, 4700), 2200).state).toBe('normal');
    expect(classifyReading(twoResistor(2200, 4700), 6900).state).toBe('alarm');
    expect(classifyReading(twoResistor(2200, 4700), Number.POSITIVE_INFINITY).state).toBe(
      'open_circuit',
    );
    expect(classifyReading(twoResistor(2200, 4700), 0.4).state).toBe('short_circuit');
  });

  // A 1 kΩ / 1 kΩ pair reads 1 kΩ secure and 2 kΩ in alarm (common practice, no source).
  it('reads 1 kΩ secure and 2 kΩ in alarm for 1k / 1k', () => {
    expect(classifyReading(twoResistor(1000, 1000), 1000).state).toBe('normal');
    expect(classifyReading(twoResistor(1000, 1000), 2000).state).toBe('alarm');
  });

  it('adds the cable to every reading, and says how far a reading sits inside its band', () => {
    // 100 m of 7/0.2 out and back ≈ 15.7 Ω (computed from IEC 60028, ../shared/checks.md).
    const design = twoResistor(2200, 4700, { min: 15.7, max: 15.7 });
    const secure = classifyReading(design, 2215.7);
    expect(secure.state).toBe('normal');
    expect(secure.marginOhms).toBeCloseTo(110, 6); // ±5 % of 2200 either side of the nominal
    const drifted = classifyReading(design, 2400);
    expect(drifted).toMatchObject({ state: 'out_of_tolerance', band: { state: 'normal' } });
    expect(drifted.marginOhms).toBeCloseTo(2400 - (2310 + 15.7), 6);
  });

  it('reports a pair whose bands overlap as a design error', () => {
    const { problems } = loopBands(twoResistor(10_000, 220));
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatch(/Normal \(up to .*\) and alarm \(from .*\) overlap/);
  });

  it.each([
    [1000, 1000],
    [2200, 4700],
    [4700, 2200],
    [2200, 2200],
    [4700, 4700],
  ])('accepts the usual pair %d / %d with 30 Ω of cable', (tamper, alarm) => {
    expect(loopBands(twoResistor(tamper, alarm, { min: 0, max: 30 })).problems).toEqual([]);
  });

  const e24Resistor = fc
    .tuple(fc.constantFrom(...E24), fc.constantFrom(100, 1000, 10_000))
    .map(([mantissa, decade]) => Math.round(mantissa * decade));
  const cable = fc.double({ min: 0, max: 40, noNaN: true }).map((max) => ({ min: 0, max }));
  const tolerance = fc.constantFrom(0.01, 0.02, 0.05, 0.1);

  it('classifies each state’s expected value as that state, for every accepted pair (property)', () => {
    fc.assert(
      fc.property(e24Resistor, e24Resistor, cable, tolerance, (tamper, alarm, cableOhms, tol) => {
        const design: LoopDesign = {
          wiring: 'two_resistor',
          tamperOhms: tamper,
          alarmOhms: alarm,
          tolerance: tol,
          cableOhms,
        };
        const { bands, problems } = loopBands(design);
        fc.pre(problems.length === 0);
        return bands.every((band) => {
          const reading =
            band.nominalOhms === Number.POSITIVE_INFINITY
              ? Number.POSITIVE_INFINITY
              : band.nominalOhms;
          return classifyReading(design, reading).state === band.state;
        });
      }),
    );
  });

  it('never lets the bands of an accepted pair overlap (property)', () => {
    fc.assert(
      fc.property(e24Resistor, e24Resistor, cable, tolerance, (tamper, alarm, cableOhms, tol) => {
        const { bands, problems } = loopBands({
          wiring: 'two_resistor',
          tamperOhms: tamper,
          alarmOhms: alarm,
          tolerance: tol,
          cableOhms,
        });
        if (problems.length > 0) return true;
        return bands.every(
          (band, index) => index === 0 || band.lowOhms > bands[index - 1]!.highOhms,
        );
      }),
    );
  });
});

describe('one-resistor and closed loops', () => {
  it('read an opened one-resistor loop as alarm: a cut and an alarm look the same', () => {
    const design: LoopDesign = {
      wiring: 'one_resistor',
      tamperOhms: null,
      alarmOhms: 4700,
      tolerance: 0.05,
      cableOhms: { min: 0, max: 10 },
    };
    expect(classifyReading(design, 4705).state).toBe('normal');
    expect(classifyReading(design, Number.POSITIVE_INFINITY).state).toBe('alarm');
    expect(classifyReading(design, 2).state).toBe('short_circuit');
  });

  it('read a closed loop as normal near 0 Ω and alarm when open', () => {
    const design: LoopDesign = {
      wiring: 'closed_loop_separate_tamper',
      tamperOhms: null,
      alarmOhms: null,
      tolerance: 0.05,
      cableOhms: { min: 0, max: 10 },
    };
    expect(classifyReading(design, 3).state).toBe('normal');
    expect(classifyReading(design, 250_000).state).toBe('alarm');
  });

  it('say what is missing rather than guess', () => {
    expect(
      loopBands({
        wiring: 'two_resistor',
        tamperOhms: 2200,
        alarmOhms: null,
        tolerance: 0.05,
        cableOhms: { min: 0, max: 0 },
      }).problems,
    ).toEqual(['The alarm resistor value is missing.']);
  });
});

describe('copper cable (IEC 60028)', () => {
  // IEC 60028 annealed copper: ρ = 1/58 Ω·mm²/m at 20 °C, α = 0.00393 /K. A 7/0.2 mm core is
  // 7 × π × 0.1² = 0.2199 mm², so 0.0784 Ω/m; 100 m out and back ≈ 15.7 Ω (../shared/checks.md).
  it('gives 0.2199 mm² and 0.0784 Ω/m for a 7/0.2 core at 20 °C', () => {
    expect(coreAreaMm2(SEVEN_STRAND_0_2)).toBeCloseTo(0.2199, 4);
    expect(coreOhmsPerMetre(SEVEN_STRAND_0_2)).toBeCloseTo(0.0784, 4);
    expect(runLoopOhms(100, coreOhmsPerMetre(SEVEN_STRAND_0_2))).toBeCloseTo(15.68, 2);
  });

  it('corrects for temperature with α = 0.00393 /K', () => {
    const at20 = coreOhmsPerMetre({ areaMm2: 1 });
    expect(at20).toBeCloseTo(1 / 58, 9);
    expect(coreOhmsPerMetre({ areaMm2: 1 }, 70)).toBeCloseTo(at20 * (1 + 0.00393 * 50), 9);
  });

  it('halves the run resistance when cores are doubled up per leg', () => {
    const perMetre = coreOhmsPerMetre(SEVEN_STRAND_0_2);
    expect(runLoopOhms(100, perMetre, 2)).toBeCloseTo(runLoopOhms(100, perMetre) / 2, 9);
  });

  it('finds the volts at a detector and the longest run that keeps its minimum', () => {
    // Worked by hand: 13.7 V supply, 30 mA, 100 m of 7/0.2 → drop 0.03 × 15.68 = 0.470 V.
    const perMetre = coreOhmsPerMetre(SEVEN_STRAND_0_2);
    expect(
      voltageAtDetector({
        supplyVolts: 13.7,
        currentAmps: 0.03,
        runMetres: 100,
        ohmsPerMetre: perMetre,
      }),
    ).toBeCloseTo(13.23, 2);
    const longest = longestRunMetres({
      supplyVolts: 13.7,
      minimumVolts: 9,
      currentAmps: 0.03,
      ohmsPerMetre: perMetre,
    });
    expect(
      voltageAtDetector({
        supplyVolts: 13.7,
        currentAmps: 0.03,
        runMetres: longest,
        ohmsPerMetre: perMetre,
      }),
    ).toBeCloseTo(9, 9);
    expect(longest).toBeCloseTo(4.7 / (2 * 0.03 * perMetre), 6);
  });
});

describe('power budget', () => {
  // C = (I_q × T_standby + I_a × T_alarm) × ageing factor (formula in ../shared/checks.md;
  // ageing factor 1.25 common practice, no source). Worked by hand:
  // (0.5 A × 12 h + 1.5 A × 0.25 h) × 1.25 = (6 + 0.375) × 1.25 = 7.96875 Ah.
  it('computes the required capacity by the formula and compares the fitted battery', () => {
    const budget = powerBudget({
      items: [
        { label: 'Panel', quiescentMa: 200, alarmMa: 300 },
        { label: 'PIR', quiescentMa: 15, alarmMa: 20, count: 20 },
        { label: 'External sounder', quiescentMa: 0, alarmMa: 800 },
      ],
      standbyHours: 12,
      alarmMinutes: 15,
      batteryAh: 7,
    });
    expect(budget).toMatchObject({
      quiescentMa: 500,
      alarmMa: 1500,
      requiredAh: 7.97,
      passes: false,
    });
    expect(budget.working).toBe('(0.5 A × 12 h + 1.5 A × 0.25 h) × 1.25 = 7.97 Ah');
  });

  // EN 50131-6 type A standby (from memory, corroborated by public PD 6662 summaries;
  // ../shared/checks.md): grades 1–2 12 h; grades 3–4 60 h, 30 h with mains failure signalled.
  it('looks up standby hours from one table with its source', () => {
    expect(STANDBY_HOURS_TYPE_A).toEqual({
      grades1and2: 12,
      grades3and4: 60,
      grades3and4WithMainsFailureSignalled: 30,
    });
    expect(standbyHours({ grade: 2, psuType: 'A', mainsFailureSignalled: true })).toMatchObject({
      hours: 12,
    });
    expect(standbyHours({ grade: 3, psuType: 'A', mainsFailureSignalled: false })).toMatchObject({
      hours: 60,
    });
    expect(standbyHours({ grade: 4, psuType: 'A', mainsFailureSignalled: true })).toMatchObject({
      hours: 30,
    });
    expect(standbyHours({ grade: 3, psuType: 'B', mainsFailureSignalled: true })).toMatchObject({
      hours: null,
    });
  });

  it('refuses an alarm time beyond the 20-minute sounder limit and negative currents', () => {
    expect(() =>
      powerBudget({ items: [], standbyHours: 12, alarmMinutes: 30, batteryAh: 7 }),
    ).toThrow(/1 to 20 minutes/);
    expect(() =>
      powerBudget({
        items: [{ label: 'x', quiescentMa: -1, alarmMa: 0 }],
        standbyHours: 12,
        alarmMinutes: 15,
        batteryAh: 7,
      }),
    ).toThrow(/negative/);
  });
});

describe('grade and environmental class', () => {
  // EN 50131-1: the system grade is the lowest grade of its components.
  it('takes the lowest component grade and names what limits it', () => {
    expect(
      systemGrade([
        { label: 'Panel', grade: 3 },
        { label: 'Keypad', grade: 2 },
        { label: 'Zone 1', grade: 3 },
        { label: 'Zone 2', grade: null },
      ]),
    ).toEqual({ grade: 2, limitedBy: ['Keypad'], ungraded: ['Zone 2'] });
  });

  it('flags outdoor equipment below class IV and unheated spaces below class II', () => {
    expect(
      environmentalMismatches(
        [
          {
            label: 'External sounder',
            location: 'Front elevation, under the eaves',
            environmentalClass: 2,
          },
          { label: 'Zone 7', location: 'Garage', environmentalClass: 1 },
          { label: 'Zone 2', location: 'Hall', environmentalClass: 2 },
        ],
        2,
      ),
    ).toEqual([
      {
        label: 'External sounder',
        location: 'Front elevation, under the eaves',
        environmentalClass: 2,
        required: 4,
        why: 'outdoors',
      },
      {
        label: 'Zone 7',
        location: 'Garage',
        environmentalClass: 1,
        required: 2,
        why: 'indoors but unheated',
      },
    ]);
  });
});
