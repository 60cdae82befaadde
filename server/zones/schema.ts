import { z } from 'zod';
import {
  fittedComponentFields,
  fittedComponentRecordFields,
  idSchema,
  trimmed,
  versionSchema,
} from '../schema/fields';

export const ZONE_TYPES = [
  'entry_exit',
  'entry_route',
  'instant',
  '24_hour',
  'hold_up',
  'fire',
  'technical',
  'set_unset',
  'unassigned',
] as const;
export type ZoneType = (typeof ZONE_TYPES)[number];

/** The trade's names for zone types (product.md vocabulary). */
export const ZONE_TYPE_LABELS: Record<ZoneType, string> = {
  entry_exit: 'Entry/exit',
  entry_route: 'Entry route',
  instant: 'Instant',
  '24_hour': '24-hour',
  hold_up: 'Hold-up (PA)',
  fire: 'Fire',
  technical: 'Technical',
  set_unset: 'Set/unset switch',
  unassigned: 'Unassigned',
};

export const DETECTOR_KINDS = [
  'pir',
  'dual_technology',
  'magnetic_contact',
  'vibration',
  'glass_break',
  'hold_up_button',
  'smoke',
  'heat',
  'key_switch',
  'other',
] as const;
export type DetectorKind = (typeof DETECTOR_KINDS)[number];

export const DETECTOR_KIND_LABELS: Record<DetectorKind, string> = {
  pir: 'Passive infrared (PIR)',
  dual_technology: 'Dual technology (PIR + microwave)',
  magnetic_contact: 'Magnetic door/window contact',
  vibration: 'Vibration (shock) sensor',
  glass_break: 'Glass-break detector',
  hold_up_button: 'Hold-up button',
  smoke: 'Smoke detector',
  heat: 'Heat detector',
  key_switch: 'Key switch',
  other: 'Other',
};

export const LOOP_WIRINGS = [
  'two_resistor',
  'one_resistor',
  'closed_loop_separate_tamper',
] as const;
export type LoopWiring = (typeof LOOP_WIRINGS)[number];

export const LOOP_WIRING_LABELS: Record<LoopWiring, string> = {
  two_resistor: 'Two-resistor loop',
  one_resistor: 'One-resistor loop',
  closed_loop_separate_tamper: 'Closed loop with separate tamper pair',
};

export const ZONE_ATTRIBUTES = [
  'chime',
  'omittable',
  'part_set',
  'soak_test',
  'double_knock',
  'silent',
] as const;
export type ZoneAttribute = (typeof ZONE_ATTRIBUTES)[number];

export const ZONE_ATTRIBUTE_LABELS: Record<ZoneAttribute, string> = {
  chime: 'Chime when unset',
  omittable: 'Can be omitted',
  part_set: 'Included in part-set',
  soak_test: 'On soak test',
  double_knock: 'Double knock',
  silent: 'Silent (no local sounders)',
};

/** Core colours of alarm cable, as marked on the sheath. */
export const CORE_COLOURS = [
  'red',
  'black',
  'white',
  'yellow',
  'blue',
  'green',
  'brown',
  'grey',
  'orange',
  'pink',
  'violet',
  'screen',
] as const;

/**
 * Resistor values on alarm loops: 10 Ω to 100 kΩ (common practice, no source: supervision
 * resistors are 1k–10k, and nothing outside this range is a plausible entry in ohms).
 */
export const resistorOhmsSchema = z
  .number({ error: 'Enter the resistor value in ohms, e.g. 2200 for 2k2.' })
  .min(10, 'Resistor values start at 10 Ω. Enter ohms: 2200, not 2.2.')
  .max(100_000, 'That is over 100 kΩ. Enter ohms, e.g. 4700 for 4k7.')
  // A refinement rather than .int(): zod's .int() stops other rows' checks from running.
  .refine(Number.isInteger, 'Enter whole ohms, e.g. 4700 for 4k7.');

export const coreConnectionSchema = z
  .object({
    colour: z.enum(CORE_COLOURS, { error: 'Choose the core colour.' }),
    terminal: trimmed(16, 'Terminal').min(1, 'Name the terminal, e.g. Z1 or T+.'),
  })
  .strict();

export const zoneInputSchema = z
  .object({
    id: idSchema.optional(),
    number: z
      .number({ error: 'Enter the zone number.' })
      .min(1, 'Zone numbers start at 1.')
      .max(999, 'Zone numbers go up to 999.')
      .refine(Number.isInteger, 'Zone numbers are whole numbers.'),
    location: trimmed(120, 'Location').min(1, 'Say where the detector is, e.g. Hall.'),
    zoneType: z.enum(ZONE_TYPES, { error: 'Choose the zone type.' }),
    detectorKind: z.enum(DETECTOR_KINDS, { error: 'Choose the detector kind.' }),
    detectorModel: trimmed(120, 'Model').default(''),
    loopWiring: z.enum(LOOP_WIRINGS, { error: 'Choose how the loop is wired.' }),
    tamperOhms: resistorOhmsSchema.nullable().default(null),
    alarmOhms: resistorOhmsSchema.nullable().default(null),
    coreMap: z.array(coreConnectionSchema).max(12).default([]),
    cableMetres: z
      .number({ error: 'Enter the cable run in metres.' })
      .min(0, 'A cable run cannot be negative.')
      .max(2000, 'That is over 2 km; enter the run in metres.')
      .nullable()
      .default(null),
    coresPerLeg: z
      .number()
      .int()
      .min(1, 'At least one core per leg.')
      .max(4, 'At most four cores doubled up per leg.')
      .default(1),
    ...fittedComponentFields,
    attributes: z.array(z.enum(ZONE_ATTRIBUTES)).max(ZONE_ATTRIBUTES.length).default([]),
  })
  .strict()
  .superRefine((zone, context) => {
    const need = (field: 'tamperOhms' | 'alarmOhms', message: string) =>
      context.addIssue({ code: 'custom', path: [field], message });
    if (zone.loopWiring === 'two_resistor') {
      if (zone.tamperOhms === null)
        need('tamperOhms', 'A two-resistor loop needs its series (tamper) resistor.');
      if (zone.alarmOhms === null)
        need('alarmOhms', 'A two-resistor loop needs its alarm resistor.');
    }
    if (zone.loopWiring === 'one_resistor') {
      if (zone.alarmOhms === null)
        need('alarmOhms', 'A one-resistor loop needs its resistor value.');
      if (zone.tamperOhms !== null)
        need('tamperOhms', 'A one-resistor loop has no separate tamper resistor.');
    }
    if (zone.loopWiring === 'closed_loop_separate_tamper') {
      if (zone.tamperOhms !== null)
        need('tamperOhms', 'A closed loop has no resistors; clear this value.');
      if (zone.alarmOhms !== null)
        need('alarmOhms', 'A closed loop has no resistors; clear this value.');
    }
  });
export type ZoneInput = z.input<typeof zoneInputSchema>;

/** Numbers must be unique within a schedule; checked even when other rows have mistakes. */
function flagDuplicateNumbers(zones: unknown[], context: z.RefinementCtx) {
  const firstRow = new Map<number, number>();
  zones.forEach((zone, index) => {
    const number = (zone as { number?: unknown } | null)?.number;
    if (typeof number !== 'number') return;
    const first = firstRow.get(number);
    if (first !== undefined) {
      context.addIssue({
        code: 'custom',
        path: [index, 'number'],
        message: `Zone ${number} is already used in row ${first + 1}.`,
      });
    } else firstRow.set(number, index);
  });
  const ids = zones.map((zone) => (zone as { id?: unknown } | null)?.id).filter(Boolean);
  if (new Set(ids).size !== ids.length) {
    context.addIssue({
      code: 'custom',
      path: [],
      message: 'A zone appears twice in the schedule.',
    });
  }
}

export const saveZonesSchema = z
  .object({
    zonesVersion: versionSchema,
    zones: z
      .array(zoneInputSchema)
      .max(512, 'A schedule holds at most 512 zones.')
      // The rows are read defensively because this runs even when some failed their checks.
      .superRefine((zones, context) => flagDuplicateNumbers(zones, context), { when: () => true }),
  })
  .strict();
export type SaveZonesInput = z.input<typeof saveZonesSchema>;

// --- Responses ---------------------------------------------------------------------------------

export const zoneSchema = z.object({
  id: z.string(),
  position: z.number(),
  number: z.number(),
  location: z.string(),
  zoneType: z.enum(ZONE_TYPES),
  detectorKind: z.enum(DETECTOR_KINDS),
  detectorModel: z.string(),
  loopWiring: z.enum(LOOP_WIRINGS),
  tamperOhms: z.number().nullable(),
  alarmOhms: z.number().nullable(),
  coreMap: z.array(z.object({ colour: z.enum(CORE_COLOURS), terminal: z.string() })),
  cableMetres: z.number().nullable(),
  coresPerLeg: z.number(),
  ...fittedComponentRecordFields,
  attributes: z.array(z.enum(ZONE_ATTRIBUTES)),
});
export type Zone = z.infer<typeof zoneSchema>;

export const zoneScheduleSchema = z.object({
  /** Null until the system (panel, areas) is recorded; zones need a system to hang on. */
  zonesVersion: z.number().nullable(),
  areas: z.array(z.object({ id: z.string(), number: z.number(), name: z.string() })),
  zones: z.array(zoneSchema),
});
export type ZoneSchedule = z.infer<typeof zoneScheduleSchema>;
