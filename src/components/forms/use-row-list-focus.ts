import { editableRowIds } from '@/components/forms/editable-row-ids';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';

type UseRowListFocusOptions = {
  /** react-hook-form's field array: each field's id stays with its row while it moves. */
  fields: readonly { id: string }[];
  move: (from: number, to: number) => void;
  remove: (index: number) => void;
  /** As given to `editableRowIds` for the rows: "zone", "device". */
  rowKind: string;
  /** Where focus goes once no row is left. */
  addButtonId: string;
};

/**
 * Moves and removes rows of a list editor without dropping keyboard focus at the top of the page.
 * The person carries on from the button they pressed, or from the next row's heading.
 */
export function useRowListFocus({
  fields,
  move,
  remove,
  rowKind,
  addButtonId,
}: UseRowListFocusOptions) {
  const focusAfterRender = useFocusAfterRender();

  /** Returns false when there is no such row, so the caller announces nothing. */
  const moveRow = (index: number, to: number): boolean => {
    const field = fields[index];
    if (!field) return false;
    move(index, to);
    const ids = editableRowIds(rowKind, field.id);
    // Keep focus on the button pressed; at the top or bottom it is disabled, so use the other.
    focusAfterRender(...(to < index ? [ids.up, ids.down] : [ids.down, ids.up]));
    return true;
  };

  const removeRow = (index: number) => {
    const neighbour = fields[index + 1] ?? fields[index - 1];
    remove(index);
    focusAfterRender(neighbour ? editableRowIds(rowKind, neighbour.id).heading : addButtonId);
  };

  return { moveRow, removeRow };
}
