import { z } from 'zod';
import { ACCEPTED_FORMS, parseResistance } from '../calc/notation';
import { gradeSchema, milliampsSchema } from '../schema/fields';

/**
 * A resistance typed any way an engineer writes it (see calc/notation): parsed here, so a
 * bad value comes back as a field error naming the accepted forms.
 */
export const resistanceSchema = z.union([z.number(), z.string()]).transform((value, context) => {
  const parsed = parseResistance(value);
  if (!parsed.ok) {
    context.addIssue({ code: 'custom', message: parsed.message });
    return z.NEVER;
  }
  return parsed.ohms;
});

/** A positive resistor value (not 0 Ω). */
export const resistorValueSchema = resistanceSchema.refine(
  (ohms) => ohms > 0,
  'A resistor value is more than 0 Ω.',
);

const OPEN_WORDS = /^(ol|o\.l\.|open|∞|inf|infinity)$/i;

/** A meter reading: a resistance, or "OL" / "open" for an open circuit (Infinity). */
export const readingSchema = z.union([z.number(), z.string()]).transform((value, context) => {
  if (typeof value === 'string' && OPEN_WORDS.test(value.trim())) return Number.POSITIVE_INFINITY;
  const parsed = parseResistance(value);
  if (!parsed.ok) {
    context.addIssue({
      code: 'custom',
      message: `${parsed.message} For an open circuit enter OL.`,
    });
    return z.NEVER;
  }
  return parsed.ohms;
});

export const READING_FORMS = `${ACCEPTED_FORMS}, or OL for an open circuit`;

export const resistanceQuerySchema = z.object({ value: resistorValueSchema }).strict();

export const toleranceSchema = z.union(
  [z.literal(0.01), z.literal(0.02), z.literal(0.05), z.literal(0.1)],
  {
    error: 'Choose ±1 %, ±2 %, ±5 % or ±10 %.',
  },
);

const cableInputSchema = z
  .object({
    core: z.enum(['7/0.2', '16/0.2']).optional(),
    areaMm2: z
      .number()
      .positive('The core area is more than 0 mm².')
      .max(10, 'Alarm cable cores are under 10 mm².')
      .optional(),
    runMetres: z.number().min(0, 'A run cannot be negative.').max(2000, 'That is over 2 km.'),
    coresPerLeg: z.number().int().min(1).max(4).default(1),
    temperatureC: z
      .number()
      .min(-30, 'Colder than −30 °C?')
      .max(90, 'Hotter than 90 °C?')
      .default(20),
  })
  .strict()
  .refine((cable) => Boolean(cable.core) !== Boolean(cable.areaMm2), {
    message: 'Give either the core build (7/0.2) or the core area, not both.',
    path: ['core'],
  });

export const loopQuerySchema = z
  .object({
    wiring: z.enum(['two_resistor', 'one_resistor', 'closed_loop_separate_tamper']),
    tamperOhms: resistorValueSchema.nullable().default(null),
    alarmOhms: resistorValueSchema.nullable().default(null),
    tolerance: toleranceSchema.default(0.05),
    cable: cableInputSchema.nullable().default(null),
    reading: readingSchema.nullable().default(null),
  })
  .strict()
  .superRefine((loop, context) => {
    const missing = (path: 'tamperOhms' | 'alarmOhms', message: string) =>
      context.addIssue({ code: 'custom', path: [path], message });
    if (loop.wiring === 'two_resistor' && loop.tamperOhms === null)
      missing('tamperOhms', 'A two-resistor loop needs its series (tamper) resistor.');
    if (loop.wiring !== 'closed_loop_separate_tamper' && loop.alarmOhms === null)
      missing('alarmOhms', 'Enter the alarm (or end-of-line) resistor.');
  });

export const cableQuerySchema = cableInputSchema.and(
  z.object({
    supplyVolts: z.number().min(9).max(30).default(13.7),
    currentMa: milliampsSchema,
    minimumVolts: z.number().min(0).max(30).default(9),
  }),
);

export const powerQuerySchema = z
  .object({
    items: z
      .array(
        z
          .object({
            label: z.string().trim().min(1).max(80),
            quiescentMa: milliampsSchema,
            alarmMa: milliampsSchema,
            count: z.number().int().min(1).max(500).default(1),
          })
          .strict(),
      )
      .min(1, 'List at least one powered item.')
      .max(500),
    grade: gradeSchema,
    psuType: z.enum(['A', 'B', 'C']),
    mainsFailureSignalled: z.boolean().default(false),
    standbyHoursOverride: z.number().positive().max(240).nullable().default(null),
    alarmMinutes: z
      .number()
      .int()
      .min(1)
      .max(20, 'External sounders must stop within 20 minutes.')
      .default(15),
    batteryAh: z.number().positive().max(200).nullable().default(null),
  })
  .strict();

export const gradeQuerySchema = z
  .object({
    components: z
      .array(
        z
          .object({ label: z.string().trim().min(1).max(80), grade: gradeSchema.nullable() })
          .strict(),
      )
      .min(1)
      .max(600),
  })
  .strict();
