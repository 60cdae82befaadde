import { z } from 'zod';
import {
  dateSchema,
  emailSchema,
  idSchema,
  phoneSchema,
  required,
  trimmed,
  versionSchema,
  withoutDefaults,
} from '../schema/fields';

export const unavailableSchema = z
  .object({
    from: dateSchema,
    to: dateSchema,
    note: trimmed(120, 'Note').default(''),
  })
  .strict()
  .refine((range) => range.to >= range.from, {
    path: ['to'],
    message: 'The end date is before the start.',
  });

/**
 * Keyholders should reach the site within 20 minutes (NPCC policy as quoted by monitoring
 * centres); longer times are allowed but flagged by the screens, not refused.
 */
export const KEYHOLDER_TARGET_MINUTES = 20;

const keyholderFields = {
  name: required(120, 'Name'),
  phone: phoneSchema,
  email: emailSchema.nullable().default(null),
  relation: trimmed(60, 'Relation').default(''),
  minutesToAttend: z
    .number({ error: 'Say how many minutes they take to reach the site.' })
    .int('Whole minutes, please.')
    .min(1, 'At least 1 minute.')
    .max(240, 'More than 4 hours is too far to be a keyholder.'),
  unavailable: z.array(unavailableSchema).max(20).default([]),
};

export const createKeyholderSchema = z.object(keyholderFields).strict();
export type CreateKeyholderInput = z.input<typeof createKeyholderSchema>;

export const updateKeyholderSchema = z
  .object({ ...withoutDefaults(keyholderFields), version: versionSchema })
  .partial()
  .required({ version: true })
  .strict();
export type UpdateKeyholderInput = z.input<typeof updateKeyholderSchema>;

export const reorderKeyholdersSchema = z
  .object({ keyholderIds: z.array(idSchema).min(1).max(50) })
  .strict()
  .refine((body) => new Set(body.keyholderIds).size === body.keyholderIds.length, {
    path: ['keyholderIds'],
    message: 'A keyholder appears twice in the new order.',
  });

export const keyholderSchema = z.object({
  id: z.string(),
  callOrder: z.number(),
  name: z.string(),
  phone: z.string(),
  email: z.string().nullable(),
  relation: z.string(),
  minutesToAttend: z.number(),
  unavailable: z.array(z.object({ from: z.string(), to: z.string(), note: z.string() })),
  lastConfirmedAt: z.string().nullable(),
  hasAccount: z.boolean(),
  version: z.number(),
});
export type Keyholder = z.infer<typeof keyholderSchema>;

export const keyholderListSchema = z.object({ keyholders: z.array(keyholderSchema) });
