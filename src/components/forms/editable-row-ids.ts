import { rowActionIds } from '@/components/ui/row-action-ids';

/**
 * The ids inside one row of a list editor ("zone-<key>-heading", "zone-<key>-move-up", …), so
 * the list can put focus back on a row's heading or buttons after rows move or go. The key is
 * react-hook-form's field id, which stays with the row while it moves.
 */
export function editableRowIds(rowKind: string, rowKey: string) {
  const idPrefix = `${rowKind}-${rowKey}`;
  return { idPrefix, heading: `${idPrefix}-heading`, ...rowActionIds(idPrefix) };
}
