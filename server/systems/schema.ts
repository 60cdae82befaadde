import { z } from 'zod';
import { gradeSchema, idSchema, milliampsSchema, trimmed, versionSchema } from '../schema/fields';

export const PSU_TYPES = ['A', 'B', 'C'] as const;
export const NOTIFICATION_OPTIONS = ['A', 'B', 'C', 'D', 'E', 'F'] as const;
export const BEARERS = ['ip', 'cellular', 'pstn', 'radio'] as const;
export const RESISTOR_TOLERANCES = [0.01, 0.02, 0.05, 0.1] as const;
export const CABLE_CORES = ['7/0.2', '16/0.2'] as const;

export const signallingPathSchema = z
  .object({
    bearer: z.enum(BEARERS, { error: 'Choose IP, cellular, telephone line or radio.' }),
    atsCategory: trimmed(8, 'ATS category')
      .regex(/^((SP|DP)\d)?$/i, 'Write the category as on the equipment, e.g. SP2 or DP3.')
      .transform((value) => value.toUpperCase())
      .default(''),
    description: trimmed(200, 'Description').default(''),
    toMonitoringCentre: z.boolean().default(true),
  })
  .strict();

export const areaInputSchema = z
  .object({
    id: idSchema.optional(),
    number: z.number().int().min(1, 'Area numbers start at 1.').max(99),
    name: trimmed(60, 'Area name').min(1, 'Name the area, e.g. Ground floor.'),
  })
  .strict();

export const saveSystemSchema = z
  .object({
    controlPanel: trimmed(120, 'Control panel').default(''),
    firmware: trimmed(60, 'Firmware').default(''),
    panelLocation: trimmed(120, 'Panel location').default(''),
    psuType: z.enum(PSU_TYPES).nullable().default(null),
    batteryAh: z
      .number()
      .positive('Battery capacity must be more than 0 Ah.')
      .max(200, 'That is more than 200 Ah; enter the capacity in ampere-hours.')
      .nullable()
      .default(null),
    notification: z.enum(NOTIFICATION_OPTIONS).nullable().default(null),
    mainsFailureSignalled: z.boolean().default(false),
    panelGrade: gradeSchema.nullable().default(null),
    panelQuiescentMa: milliampsSchema.nullable().default(null),
    panelAlarmMa: milliampsSchema.nullable().default(null),
    sounderMinutes: z
      .number({ error: 'Enter the sounder cut-off in minutes.' })
      .int('Whole minutes, please.')
      .min(1, 'At least 1 minute.')
      .max(20, 'External sounders must stop within 20 minutes.')
      .default(15),
    standbyHoursOverride: z
      .number()
      .positive('Standby time must be more than 0 hours.')
      .max(240, 'More than 240 hours is not a standby time.')
      .nullable()
      .default(null),
    resistorTolerance: z
      .union(
        RESISTOR_TOLERANCES.map((tolerance) => z.literal(tolerance)),
        {
          error: 'Choose ±1 %, ±2 %, ±5 % or ±10 %.',
        },
      )
      .default(0.05),
    cableCore: z.enum(CABLE_CORES).default('7/0.2'),
    supplyVolts: z
      .number()
      .min(9, 'Supplies run from 9 V.')
      .max(30, 'Supplies run up to 30 V.')
      .default(13.7),
    signallingPaths: z
      .array(signallingPathSchema)
      .max(4, 'At most four signalling paths.')
      .default([]),
    areas: z
      .array(areaInputSchema)
      .max(32)
      // Checked even when other rows have mistakes, so every problem shows at once.
      .superRefine(
        (areas, context) => {
          const seen = new Map<number, number>();
          areas.forEach((area, index) => {
            const number = (area as { number?: unknown } | null)?.number;
            if (typeof number !== 'number') return;
            const first = seen.get(number);
            if (first !== undefined) {
              context.addIssue({
                code: 'custom',
                path: [index, 'number'],
                message: `Area ${number} is already used in row ${first + 1}.`,
              });
            } else seen.set(number, index);
          });
        },
        { when: () => true },
      )
      .default([]),
    /** null when the system is recorded for the first time. */
    version: versionSchema.nullable(),
  })
  .strict()
  .superRefine((system, context) => {
    if (system.psuType === 'C' && system.batteryAh !== null) {
      context.addIssue({
        code: 'custom',
        path: ['batteryAh'],
        message: 'A type C power supply has no standby battery of its own.',
      });
    }
  });
export type SaveSystemInput = z.input<typeof saveSystemSchema>;

// --- Responses ---------------------------------------------------------------------------------

export const areaSchema = z.object({ id: z.string(), number: z.number(), name: z.string() });
export type Area = z.infer<typeof areaSchema>;

export const systemSchema = z.object({
  id: z.string(),
  controlPanel: z.string(),
  firmware: z.string(),
  panelLocation: z.string(),
  psuType: z.enum(PSU_TYPES).nullable(),
  batteryAh: z.number().nullable(),
  notification: z.enum(NOTIFICATION_OPTIONS).nullable(),
  mainsFailureSignalled: z.boolean(),
  panelGrade: z.number().nullable(),
  panelQuiescentMa: z.number().nullable(),
  panelAlarmMa: z.number().nullable(),
  sounderMinutes: z.number(),
  standbyHoursOverride: z.number().nullable(),
  resistorTolerance: z.number(),
  cableCore: z.enum(CABLE_CORES),
  supplyVolts: z.number(),
  signallingPaths: z.array(
    z.object({
      id: z.string(),
      position: z.number(),
      bearer: z.enum(BEARERS),
      atsCategory: z.string(),
      description: z.string(),
      toMonitoringCentre: z.boolean(),
    }),
  ),
  areas: z.array(areaSchema),
  version: z.number(),
  updatedAt: z.string(),
});
export type SystemRecord = z.infer<typeof systemSchema>;

export const systemResponseSchema = z.object({ system: systemSchema.nullable() });
