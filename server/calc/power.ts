/**
 * The standby battery a system needs:
 *
 *   capacity (Ah) = (I_quiescent × T_standby + I_alarm × T_alarm) × ageing factor
 *
 * with currents in amps and times in hours. The ageing factor of 1.25 allows for the battery's
 * loss of capacity over its life (common practice, no source).
 */
export type PsuType = 'A' | 'B' | 'C';

/**
 * Standby hours a power supply must give, by grade (EN 50131-6, from memory, corroborated by
 * public PD 6662 summaries; ../shared/checks.md). Type A supplies charge their battery from
 * the mains. Types B and C are not in this table: their standby time comes from the site's
 * specification and must be entered.
 */
export const STANDBY_HOURS_TYPE_A = {
  grades1and2: 12,
  grades3and4: 60,
  grades3and4WithMainsFailureSignalled: 30,
} as const;
export const STANDBY_SOURCE =
  'EN 50131-6 standby periods for type A supplies (from memory; corroborated by public PD 6662 summaries)';

export const DEFAULT_AGEING_FACTOR = 1.25;
/** External sounders must stop after 20 minutes (Clean Neighbourhoods and Environment Act 2005 guidance); 15 is usual. */
export const MAX_SOUNDER_MINUTES = 20;
export const DEFAULT_SOUNDER_MINUTES = 15;

export type StandbyHours = { hours: number; source: string } | { hours: null; reason: string };

export function standbyHours(options: {
  grade: number;
  psuType: PsuType | null;
  mainsFailureSignalled: boolean;
}): StandbyHours {
  if (options.psuType !== 'A') {
    return {
      hours: null,
      reason:
        options.psuType === null
          ? 'Record the power supply type (A, B or C) to look up its standby time.'
          : `Type ${options.psuType} supplies are not in Wardbook's standby table; enter the standby time the specification requires.`,
    };
  }
  if (options.grade <= 2)
    return { hours: STANDBY_HOURS_TYPE_A.grades1and2, source: STANDBY_SOURCE };
  return {
    hours: options.mainsFailureSignalled
      ? STANDBY_HOURS_TYPE_A.grades3and4WithMainsFailureSignalled
      : STANDBY_HOURS_TYPE_A.grades3and4,
    source: STANDBY_SOURCE,
  };
}

export interface PoweredItem {
  label: string;
  quiescentMa: number;
  alarmMa: number;
  count?: number;
}

export interface PowerBudgetInput {
  items: PoweredItem[];
  standbyHours: number;
  alarmMinutes: number;
  ageingFactor?: number;
  batteryAh: number | null;
}

export interface PowerBudget {
  quiescentMa: number;
  alarmMa: number;
  standbyHours: number;
  alarmHours: number;
  ageingFactor: number;
  standbyAh: number;
  alarmAh: number;
  requiredAh: number;
  batteryAh: number | null;
  /** Null when no battery is recorded. */
  passes: boolean | null;
  /** The sum as a person would write it, with these numbers in it. */
  working: string;
}

const round = (value: number, places: number) => Math.round(value * 10 ** places) / 10 ** places;

export function powerBudget(input: PowerBudgetInput): PowerBudget {
  if (!(input.standbyHours > 0)) throw new RangeError('standby hours must be more than 0');
  if (!(input.alarmMinutes > 0) || input.alarmMinutes > MAX_SOUNDER_MINUTES) {
    throw new RangeError(`the alarm time is 1 to ${MAX_SOUNDER_MINUTES} minutes`);
  }
  const ageingFactor = input.ageingFactor ?? DEFAULT_AGEING_FACTOR;
  let quiescentMa = 0;
  let alarmMa = 0;
  for (const item of input.items) {
    const count = item.count ?? 1;
    if (item.quiescentMa < 0 || item.alarmMa < 0 || count < 0)
      throw new RangeError(`negative current for ${item.label}`);
    quiescentMa += item.quiescentMa * count;
    alarmMa += item.alarmMa * count;
  }
  const alarmHours = input.alarmMinutes / 60;
  const standbyAh = (quiescentMa / 1000) * input.standbyHours;
  const alarmAh = (alarmMa / 1000) * alarmHours;
  const requiredAh = (standbyAh + alarmAh) * ageingFactor;
  const working =
    `(${round(quiescentMa / 1000, 3)} A × ${input.standbyHours} h + ${round(alarmMa / 1000, 3)} A × ${round(alarmHours, 3)} h)` +
    ` × ${ageingFactor} = ${round(requiredAh, 2)} Ah`;
  return {
    quiescentMa: round(quiescentMa, 2),
    alarmMa: round(alarmMa, 2),
    standbyHours: input.standbyHours,
    alarmHours: round(alarmHours, 4),
    ageingFactor,
    standbyAh: round(standbyAh, 3),
    alarmAh: round(alarmAh, 3),
    requiredAh: round(requiredAh, 2),
    batteryAh: input.batteryAh,
    passes: input.batteryAh === null ? null : input.batteryAh >= round(requiredAh, 2),
    working,
  };
}
