import type { ReactNode } from 'react';

import { editableRowIds } from '@/components/forms/editable-row-ids';
import { FieldErrorMessage } from '@/components/ui/form-field';
import { RowActions } from '@/components/ui/row-actions';

type EditableRowListProps = {
  /** The list's accessible name: "Zone schedule", "Devices". */
  label: string;
  rowCount: number;
  /** Shown instead of the list while it has no rows: what to add, and that saving is next. */
  emptyMessage: string;
  /** A check on the list as a whole, such as two rows with the same zone number. */
  error?: string;
  children: ReactNode;
};

/** The rows of a list editor, numbered in the order they are saved. */
export function EditableRowList({
  label,
  rowCount,
  emptyMessage,
  error,
  children,
}: EditableRowListProps) {
  return (
    <>
      {rowCount === 0 ? (
        <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
          {emptyMessage}
        </p>
      ) : (
        <ol aria-label={label} className="grid gap-3">
          {children}
        </ol>
      )}
      <FieldErrorMessage message={error} />
    </>
  );
}

/** What a list editor hands each of its rows: where the row stands, and its buttons' actions. */
export type EditableRowPlace = {
  index: number;
  rowCount: number;
  /** Stable while the row moves, for ids that focus can return to. */
  rowKey: string;
  onMoveUp: () => void;
  onMoveDown: () => void;
  onDuplicate: () => void;
  onRemove: () => void;
};

type EditableRowProps = {
  place: EditableRowPlace;
  /** As given to `editableRowIds`: "zone", "device". */
  rowKind: string;
  /** How the buttons name the row: "zone 3", "device 2". */
  itemName: string;
  /** Names the row; it also labels the row's group of fields. */
  heading: ReactNode;
  children: ReactNode;
};

/**
 * One row of a list editor as a compact block of fields under a heading, with buttons to move,
 * duplicate and remove it. The heading can take focus, so that removing the row before it
 * leaves the person on the next row rather than at the top of the page.
 */
export function EditableRow({ place, rowKind, itemName, heading, children }: EditableRowProps) {
  const { index, rowCount, rowKey, onMoveUp, onMoveDown, onDuplicate, onRemove } = place;
  const ids = editableRowIds(rowKind, rowKey);
  return (
    <li className="rounded-lg border border-hairline bg-white">
      <div role="group" aria-labelledby={ids.heading}>
        <div className="flex flex-wrap items-center justify-between gap-2 border-b border-hairline bg-paper/60 px-3 py-2">
          <h3 id={ids.heading} tabIndex={-1} className="min-w-0 text-sm font-semibold">
            {heading}
          </h3>
          <RowActions
            itemName={itemName}
            idPrefix={ids.idPrefix}
            isFirst={index === 0}
            isLast={index === rowCount - 1}
            onMoveUp={onMoveUp}
            onMoveDown={onMoveDown}
            onDuplicate={onDuplicate}
            onRemove={onRemove}
          />
        </div>
        <div className="grid grid-cols-2 gap-3 p-3 sm:grid-cols-4 xl:grid-cols-12">{children}</div>
      </div>
    </li>
  );
}
