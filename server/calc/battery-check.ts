/**
 * The standby battery at a service visit: its voltage at rest and under a load test against the
 * minimums for a sound battery, and the fitted capacity against the system's power budget
 * (calc/power.ts). Pure: the caller supplies the readings, the minimums and the budget.
 */

export interface BatteryReadings {
  restingVolts: number;
  loadTestVolts: number;
  /** The current drawn during the load test; null when the engineer did not measure it. */
  loadTestAmps: number | null;
}

/** The minimums for the battery as fitted (a 24 V supply has two 12 V batteries in series). */
export interface BatteryMinimums {
  restingVolts: number;
  loadedVolts: number;
}

/** What the power budget says about this system, or why it could not be worked out. */
export type BudgetFacts =
  | {
      available: true;
      requiredAh: number;
      /** The fitted battery's capacity as recorded; null when not recorded. */
      batteryAh: number | null;
      /** The system's current in alarm (panel, detectors, sounders). */
      alarmMa: number;
      /** The budget's sum with its numbers, as calc/power.ts writes it. */
      working: string;
    }
  | { available: false; reason: string };

export interface BatteryVerdict {
  passed: boolean;
  /** Why it failed, one sentence each; empty when it passed. */
  reasons: string[];
  /** What the engineer and the office should know whatever the verdict. */
  notes: string[];
}

const volts = (value: number) => `${Number(value.toFixed(2))} V`;
const amps = (value: number) => `${Number(value.toFixed(3))} A`;

export function batteryCheck(
  readings: BatteryReadings,
  minimums: BatteryMinimums,
  budget: BudgetFacts,
): BatteryVerdict {
  const reasons: string[] = [];
  const notes: string[] = [];
  if (readings.restingVolts < minimums.restingVolts)
    reasons.push(
      `It rests at ${volts(readings.restingVolts)}, below the ${volts(minimums.restingVolts)} of a sound battery: it is discharged or failing.`,
    );
  if (readings.loadTestVolts < minimums.loadedVolts)
    reasons.push(
      `It fell to ${volts(readings.loadTestVolts)} under load, below ${volts(minimums.loadedVolts)}: it cannot hold the system up.`,
    );

  if (!budget.available) {
    notes.push(`Its capacity could not be checked against the power budget: ${budget.reason}`);
  } else if (budget.batteryAh === null) {
    notes.push(
      `No fitted capacity is recorded, so it could not be checked against the power budget (${budget.requiredAh} Ah needed: ${budget.working}).`,
    );
  } else if (budget.batteryAh < budget.requiredAh) {
    reasons.push(
      `The fitted ${budget.batteryAh} Ah is less than the power budget needs: ${budget.working}.`,
    );
  } else {
    notes.push(`The fitted ${budget.batteryAh} Ah covers the power budget: ${budget.working}.`);
  }

  // A load lighter than the alarm load proves less than it seems: the sounders draw more.
  // (Common practice, no source.)
  if (budget.available && readings.loadTestAmps !== null) {
    const alarmAmps = budget.alarmMa / 1000;
    if (readings.loadTestAmps < alarmAmps)
      notes.push(
        `The load test drew ${amps(readings.loadTestAmps)}, less than the ${amps(alarmAmps)} the system draws in alarm: it does not show the battery carrying an alarm.`,
      );
  }
  return { passed: reasons.length === 0, reasons, notes };
}
