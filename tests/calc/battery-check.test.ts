import { describe, expect, it } from 'vitest';
import { batteryCheck, type BudgetFacts } from '../../server/calc/battery-check';
import { powerBudget } from '../../server/calc/power';

// Minimums for a sound 12 V lead-acid battery: 12.5 V at rest, 12.0 V under load
// (common practice, no source; the same values commissioning uses).
const twelveVolt = { restingVolts: 12.5, loadedVolts: 12.0 };

// A grade 2 system on a type A supply: 12 h standby (EN 50131-6, from memory, corroborated by
// public PD 6662 summaries), 15 min of alarm, ageing factor 1.25 (common practice, no source).
// By hand: (0.14 A × 12 h + 0.21 A × 0.25 h) × 1.25 = (1.68 + 0.0525) × 1.25 = 2.17 Ah.
const budget = powerBudget({
  items: [{ label: 'Panel and detectors', quiescentMa: 140, alarmMa: 210 }],
  standbyHours: 12,
  alarmMinutes: 15,
  batteryAh: 7,
});
const facts = (batteryAh: number | null): BudgetFacts => ({
  available: true,
  requiredAh: budget.requiredAh,
  batteryAh,
  alarmMa: budget.alarmMa,
  working: budget.working,
});

describe('the battery at a service visit', () => {
  it('passes a sound battery that covers the budget, and says so with the sum', () => {
    expect(budget.requiredAh).toBe(2.17);
    const verdict = batteryCheck(
      { restingVolts: 13.1, loadTestVolts: 12.4, loadTestAmps: 1.5 },
      twelveVolt,
      facts(7),
    );
    expect(verdict).toEqual({
      passed: true,
      reasons: [],
      notes: [`The fitted 7 Ah covers the power budget: ${budget.working}.`],
    });
    expect(budget.working).toBe('(0.14 A × 12 h + 0.21 A × 0.25 h) × 1.25 = 2.17 Ah');
  });

  it('fails a battery resting low and sagging under load, giving both reasons', () => {
    const verdict = batteryCheck(
      { restingVolts: 12.2, loadTestVolts: 11.6, loadTestAmps: 1.5 },
      twelveVolt,
      facts(7),
    );
    expect(verdict.passed).toBe(false);
    expect(verdict.reasons).toEqual([
      'It rests at 12.2 V, below the 12.5 V of a sound battery: it is discharged or failing.',
      'It fell to 11.6 V under load, below 12 V: it cannot hold the system up.',
    ]);
  });

  it('passes on the minimums themselves (they are the lowest sound values)', () => {
    const verdict = batteryCheck(
      { restingVolts: 12.5, loadTestVolts: 12.0, loadTestAmps: null },
      twelveVolt,
      facts(7),
    );
    expect(verdict.passed).toBe(true);
  });

  it('fails a battery smaller than the power budget needs, however good its voltage', () => {
    const verdict = batteryCheck(
      { restingVolts: 13.0, loadTestVolts: 12.6, loadTestAmps: null },
      twelveVolt,
      facts(2.1),
    );
    expect(verdict.passed).toBe(false);
    expect(verdict.reasons).toEqual([
      `The fitted 2.1 Ah is less than the power budget needs: ${budget.working}.`,
    ]);
  });

  it('notes, without failing, what it could not check', () => {
    const unrecorded = batteryCheck(
      { restingVolts: 13.0, loadTestVolts: 12.6, loadTestAmps: null },
      twelveVolt,
      facts(null),
    );
    expect(unrecorded.passed).toBe(true);
    expect(unrecorded.notes[0]).toMatch(/^No fitted capacity is recorded.*2\.17 Ah needed/);
    const noBudget = batteryCheck(
      { restingVolts: 13.0, loadTestVolts: 12.6, loadTestAmps: null },
      twelveVolt,
      { available: false, reason: 'Record the power supply type (A, B or C).' },
    );
    expect(noBudget).toMatchObject({ passed: true, reasons: [] });
    expect(noBudget.notes).toEqual([
      'Its capacity could not be checked against the power budget: Record the power supply type (A, B or C).',
    ]);
  });

  it('notes a load test lighter than the alarm load (common practice, no source)', () => {
    const verdict = batteryCheck(
      { restingVolts: 13.0, loadTestVolts: 12.6, loadTestAmps: 0.1 },
      twelveVolt,
      facts(7),
    );
    expect(verdict.passed).toBe(true);
    expect(verdict.notes).toContain(
      'The load test drew 0.1 A, less than the 0.21 A the system draws in alarm: it does not show the battery carrying an alarm.',
    );
  });
});
