import { z } from 'zod';

/*
 * Calculation results as the API sends them, shared by every screen that shows one (the site's
 * engineering figures, the calculators). JSON has no infinity: an open-ended band's upper edge
 * and nominal value arrive as null.
 */

export const bandSchema = z.object({
  state: z.enum(['short_circuit', 'normal', 'alarm', 'open_circuit']),
  nominalOhms: z.number().nullable(),
  lowOhms: z.number(),
  highOhms: z.number().nullable(),
});
export type ApiBand = z.infer<typeof bandSchema>;

export const powerBudgetFiguresSchema = z.object({
  /** Where the standby time came from: the table's source, or "entered" when overridden. */
  standbySource: z.string(),
  quiescentMa: z.number(),
  alarmMa: z.number(),
  standbyHours: z.number(),
  alarmHours: z.number(),
  ageingFactor: z.number(),
  standbyAh: z.number(),
  alarmAh: z.number(),
  requiredAh: z.number(),
  batteryAh: z.number().nullable(),
  /** Null when no battery capacity is recorded. */
  passes: z.boolean().nullable(),
  /** The sum written out with its figures, as a person would check it. */
  working: z.string(),
});
export type PowerBudgetFigures = z.infer<typeof powerBudgetFiguresSchema>;
