import type { CreateKeyholderInput } from '@server/keyholders/schema';

import { isUnderFields } from '@/lib/form-errors';

/** What the add and edit forms hold while someone types. */
export type KeyholderFormValues = CreateKeyholderInput;

const keyholderFieldNames: ReadonlyArray<string> = [
  'name',
  'phone',
  'email',
  'relation',
  'minutesToAttend',
  'unavailable',
] satisfies ReadonlyArray<keyof KeyholderFormValues>;

/** Whether an API error path ("unavailable.0.to") names a field these inputs show. */
export const isKeyholderField = isUnderFields(keyholderFieldNames);
