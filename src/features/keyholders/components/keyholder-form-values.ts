import type { CreateKeyholderInput } from '@server/keyholders/schema';

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
export const isKeyholderField = (fieldPath: string) =>
  keyholderFieldNames.includes(fieldPath.split('.')[0] ?? '');
