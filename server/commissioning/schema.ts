import { z } from 'zod';
import { readingSchema } from '../calculators/schema';
import { idSchema, trimmed } from '../schema/fields';

/**
 * Commissioning records are made on a phone, often where the signal is poor: each carries a
 * key made on the device, so sending it twice (after a dropped connection) records it once.
 */
const recordedOnDevice = {
  clientKey: z.uuid('Missing the record key made on the device.'),
  /** When it was done on site; a record queued offline arrives later. */
  testedAt: z.iso
    .datetime({ offset: true, error: 'Send the time as an ISO 8601 date-time.' })
    .optional(),
  note: trimmed(500, 'Note').default(''),
};

export const walkTestInputSchema = z
  .object({
    ...recordedOnDevice,
    zoneId: idSchema,
    secureReading: readingSchema,
    alarmReading: readingSchema.nullable().default(null),
    activated: z.boolean({ error: 'Say whether the panel showed the zone when you walked it.' }),
  })
  .strict();
export type WalkTestInput = z.input<typeof walkTestInputSchema>;

export const SITING_ITEMS = [
  'not_facing_windows',
  'away_from_heat',
  'out_of_direct_sun',
  'away_from_draughts',
  'clear_of_insects_and_pets',
  'height_and_angle',
] as const;
export type SitingItem = (typeof SITING_ITEMS)[number];

export const SITING_ITEM_LABELS: Record<SitingItem, string> = {
  not_facing_windows: 'Not facing a window',
  away_from_heat: 'Away from radiators, heaters, cookers and other heat sources',
  out_of_direct_sun: 'Out of direct sunlight, including sun that moves across the room',
  away_from_draughts: 'Away from draughts, air vents and fans',
  clear_of_insects_and_pets: 'Where insects cannot crawl on the lens, and beyond pets’ reach',
  height_and_angle: 'At the height and angle the maker gives, with a clear view',
};

export const sitingCheckInputSchema = z
  .object({
    ...recordedOnDevice,
    zoneId: idSchema,
    answers: z
      .object(
        Object.fromEntries(SITING_ITEMS.map((item) => [item, z.boolean()])) as Record<
          SitingItem,
          z.ZodBoolean
        >,
      )
      .strict(),
  })
  .strict();
export type SitingCheckInput = z.input<typeof sitingCheckInputSchema>;

const volts = z
  .number({ error: 'Enter volts, e.g. 12.8.' })
  .min(0, 'Volts cannot be negative.')
  .max(30, 'Over 30 V? Check the meter range.');

export const systemTestInputSchema = z.discriminatedUnion('kind', [
  z
    .object({
      ...recordedOnDevice,
      kind: z.literal('sounders'),
      internalSounded: z.boolean(),
      externalSounded: z.boolean(),
      strobeFlashed: z.boolean(),
    })
    .strict(),
  z
    .object({
      ...recordedOnDevice,
      kind: z.literal('signalling'),
      pathPosition: z.number().int().min(1).max(4),
      receivedByCentre: z.boolean(),
      centreReference: trimmed(40, 'Reference').default(''),
    })
    .strict(),
  z
    .object({
      ...recordedOnDevice,
      kind: z.literal('battery'),
      restingVolts: volts,
      loadVolts: volts,
      loadAmps: z.number().positive('Enter the load current in amps.').max(20),
      loadMinutes: z.number().int().min(1).max(120),
    })
    .strict(),
]);
export type SystemTestInput = z.input<typeof systemTestInputSchema>;

/**
 * A 12 V lead-acid battery is sound when it rests at 12.5 V or more and holds 12.0 V or more
 * under load (common practice, no source).
 */
export const BATTERY_MIN_RESTING_VOLTS = 12.5;
export const BATTERY_MIN_LOADED_VOLTS = 12.0;

// --- Responses ---------------------------------------------------------------------------------

export const LOOP_STATES = [
  'normal',
  'alarm',
  'open_circuit',
  'short_circuit',
  'out_of_tolerance',
] as const;

export const walkTestSchema = z.object({
  id: z.string(),
  zoneId: z.string(),
  secureReadingOhms: z.number().nullable(),
  secureState: z.enum(LOOP_STATES),
  alarmReadingOhms: z.number().nullable(),
  alarmState: z.enum(LOOP_STATES).nullable(),
  activated: z.boolean(),
  passed: z.boolean(),
  failures: z.array(z.string()),
  note: z.string(),
  testedBy: z.string().nullable(),
  testedAt: z.string(),
});
export type WalkTest = z.infer<typeof walkTestSchema>;

export const preIssueProblemSchema = z.object({
  code: z.string(),
  severity: z.enum(['blocking', 'advice']),
  message: z.string(),
  zoneId: z.string().nullable(),
});
export type PreIssueProblem = z.infer<typeof preIssueProblemSchema>;

export const preIssueCheckSchema = z.object({
  clear: z.boolean(),
  problems: z.array(preIssueProblemSchema),
});
export type PreIssueCheck = z.infer<typeof preIssueCheckSchema>;
