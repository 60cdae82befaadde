/**
 * Field rules shared by the API's request schemas and the browser's forms (the client imports
 * this file and the `schema.ts` files, which therefore use nothing but zod and pure helpers).
 */
import { parsePhoneNumberFromString } from 'libphonenumber-js/min';
import { z } from 'zod';

export const GRADES = [1, 2, 3, 4] as const;

/** EN 50131-1 security grade, 1 (low risk) to 4 (high risk). */
export const gradeSchema = z
  .number({ error: 'Choose a security grade from 1 to 4.' })
  .int()
  .min(1, 'Security grades run from 1 to 4.')
  .max(4, 'Security grades run from 1 to 4.');

/** EN 50131-1 environmental class I–IV, stored as 1–4. */
export const environmentalClassSchema = z
  .number({ error: 'Choose an environmental class from I to IV.' })
  .int()
  .min(1, 'Environmental classes run from I to IV.')
  .max(4, 'Environmental classes run from I to IV.');

export const ROMAN_CLASSES = ['I', 'II', 'III', 'IV'] as const;

export const versionSchema = z
  .number({ error: 'The version you edited is missing; reload and try again.' })
  .int()
  .positive();

export const idSchema = z.uuid('Not a valid id.');

export const trimmed = (max: number, label = 'This') =>
  z.string().trim().max(max, `${label} can be at most ${max} characters.`);

export const required = (max: number, label: string) =>
  trimmed(max, label).min(1, `${label} is required.`);

export const notes = (max = 4000) => z.string().max(max, `Keep this under ${max} characters.`);

/**
 * A UK phone number in any usual writing ("07700 900123", "+44 7700 900123"), stored in E.164
 * ("+447700900123"). Numbers from other countries must start with + and the country code.
 */
export const phoneSchema = z
  .string()
  .trim()
  .min(1, 'Enter a phone number.')
  .transform((value, context) => {
    const parsed = parsePhoneNumberFromString(value, 'GB');
    if (!parsed || !parsed.isPossible()) {
      context.addIssue({
        code: 'custom',
        message: 'Enter a phone number such as 07700 900123 or +44 7700 900123.',
      });
      return z.NEVER;
    }
    return parsed.number;
  });

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email('Enter an e-mail address such as name@example.com.').max(254));

// UK postcode: outward code (area, district) and inward code (sector, unit), plus GIR 0AA.
const POSTCODE = /^(GIR ?0AA|[A-PR-UWYZ][A-HK-Y]?\d[A-Z\d]? ?\d[ABD-HJLNP-UW-Z]{2})$/i;

/** A UK postcode, stored upper case with one space before the inward code ("EM4 2QT"). */
export const postcodeSchema = z
  .string()
  .trim()
  .refine((value) => POSTCODE.test(value), 'Enter a UK postcode such as AB1 2DE.')
  .transform((value) => {
    const compact = value.replace(/\s+/g, '').toUpperCase();
    return `${compact.slice(0, -3)} ${compact.slice(-3)}`;
  });

/** A calendar date as YYYY-MM-DD. */
export const dateSchema = z.iso.date('Enter a date as YYYY-MM-DD.');

/** Currents in milliamps, as on detector and device data sheets. */
export const milliampsSchema = z
  .number({ error: 'Enter the current in mA.' })
  .min(0, 'Currents cannot be negative.')
  .max(5000, 'That is more than 5 A; enter the current in mA.');

type WithoutDefault<T> = T extends z.ZodDefault<infer Inner> ? Inner : T;

/**
 * The same fields with their defaults taken off, for partial updates: zod applies a default
 * to a missing key even inside .partial(), which would overwrite stored values.
 */
export function withoutDefaults<Shape extends z.ZodRawShape>(
  shape: Shape,
): { [Key in keyof Shape]: WithoutDefault<Shape[Key]> } {
  return Object.fromEntries(
    Object.entries(shape).map(([key, field]) => [
      key,
      field instanceof z.ZodDefault ? field.unwrap() : field,
    ]),
  ) as { [Key in keyof Shape]: WithoutDefault<Shape[Key]> };
}

/**
 * Where a fitted component sits and what it is rated for, shared by zone detectors and devices:
 * its area, EN 50131 grade and environmental class, and the currents the power budget sums.
 */
export const fittedComponentFields = {
  areaId: idSchema.nullable().default(null),
  grade: gradeSchema.nullable().default(null),
  environmentalClass: environmentalClassSchema.nullable().default(null),
  quiescentMa: milliampsSchema.nullable().default(null),
  alarmMa: milliampsSchema.nullable().default(null),
};

export const fittedComponentRecordFields = {
  areaId: z.string().nullable(),
  grade: z.number().nullable(),
  environmentalClass: z.number().nullable(),
  quiescentMa: z.number().nullable(),
  alarmMa: z.number().nullable(),
};
