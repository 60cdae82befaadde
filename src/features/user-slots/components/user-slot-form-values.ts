import type { CreateUserSlotInput } from '@server/user-slots/schema';

import { isUnderFields } from '@/lib/form-errors';

/** What the add and edit forms hold while someone types. */
export type UserSlotFormValues = CreateUserSlotInput;

const userSlotFieldNames: ReadonlyArray<string> = [
  'slot',
  'holderName',
  'accessLevel',
  'areaNumbers',
  'validFrom',
  'validTo',
] satisfies ReadonlyArray<keyof UserSlotFormValues>;

/** Whether an API error path ("areaNumbers.1") names a field the slot forms show. */
export const isUserSlotField = isUnderFields(userSlotFieldNames);

/** "1, 3" → [1, 3]; anything that is not a number stays NaN so the schema can object. */
export function parseAreaNumbers(value: unknown): unknown {
  if (typeof value !== 'string') return value;
  return value
    .split(/[\s,;]+/)
    .filter(Boolean)
    .map((part) => (/^\d+$/.test(part) ? Number(part) : Number.NaN));
}

export const ACCESS_LEVEL_LABELS: Record<number, string> = {
  2: 'Level 2 (user)',
  3: 'Level 3 (engineer)',
};
