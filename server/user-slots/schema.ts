import { z } from 'zod';
import { dateSchema, required, versionSchema, withoutDefaults } from '../schema/fields';

/**
 * EN 50131-1 access levels: 2 for users who set and unset, 3 for the engineer who maintains
 * the system. Wardbook records who holds each slot, never the code itself.
 */
export const ACCESS_LEVELS = [2, 3] as const;

const slotFields = {
  holderName: required(80, 'Holder name'),
  accessLevel: z.union([z.literal(2), z.literal(3)], {
    error: 'Access level is 2 (user) or 3 (engineer).',
  }),
  areaNumbers: z.array(z.number().int().min(1).max(99)).max(32).default([]),
  validFrom: dateSchema.nullable().default(null),
  validTo: dateSchema.nullable().default(null),
};

function checkDates(
  slot: { validFrom?: string | null; validTo?: string | null },
  context: z.RefinementCtx,
) {
  if (slot.validFrom && slot.validTo && slot.validTo < slot.validFrom) {
    context.addIssue({
      code: 'custom',
      path: ['validTo'],
      message: 'The end date is before the start.',
    });
  }
}

export const createUserSlotSchema = z
  .object({
    slot: z.number({ error: 'Enter the slot number.' }).int().min(1, 'Slots start at 1.').max(999),
    ...slotFields,
  })
  .strict()
  .superRefine(checkDates);
export type CreateUserSlotInput = z.input<typeof createUserSlotSchema>;

export const updateUserSlotSchema = z
  .object({ ...withoutDefaults(slotFields), active: z.boolean(), version: versionSchema })
  .partial()
  .required({ version: true })
  .strict()
  .superRefine(checkDates);
export type UpdateUserSlotInput = z.input<typeof updateUserSlotSchema>;

/** Field names that would carry a user code; any body holding one is refused outright. */
export const CODE_LIKE_FIELD =
  /^(code|codes|pin|pins|pincode|passcode|usercode|user_code|accesscode|access_code|digits|secret)$/i;

export const userSlotSchema = z.object({
  id: z.string(),
  slot: z.number(),
  holderName: z.string(),
  accessLevel: z.number(),
  areaNumbers: z.array(z.number()),
  validFrom: z.string().nullable(),
  validTo: z.string().nullable(),
  active: z.boolean(),
  changedBy: z.string().nullable(),
  changedAt: z.string(),
  version: z.number(),
});
export type UserSlot = z.infer<typeof userSlotSchema>;

export const userSlotListSchema = z.object({ slots: z.array(userSlotSchema) });
