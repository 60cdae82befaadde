import { CircleCheck, CircleDot, Plus, RotateCcw } from 'lucide-react';

import { SubmitButton } from '@/components/forms/submit-button';
import { Button } from '@/components/ui/button';

type ListSaveBarProps = {
  /** The add button's id, where focus goes once the last row is removed. */
  addButtonId: string;
  addLabel: string;
  onAdd: () => void;
  saveLabel: string;
  isSaving: boolean;
  hasUnsavedChanges: boolean;
  /** The last save went through and nothing has been typed since. */
  isSaved: boolean;
  onDiscard: () => void;
  rowCount: number;
  /** What a row is called, for the count: ["zone", "zones"]. */
  rowNoun: readonly [singular: string, plural: string];
};

/**
 * The bar under a list editor: add a row, save the list or throw the changes away, and how many
 * rows there are. Whether the list is saved is said in words with an icon, never colour alone.
 */
export function ListSaveBar({
  addButtonId,
  addLabel,
  onAdd,
  saveLabel,
  isSaving,
  hasUnsavedChanges,
  isSaved,
  onDiscard,
  rowCount,
  rowNoun,
}: ListSaveBarProps) {
  return (
    <div className="flex flex-wrap items-center gap-3 rounded-lg border border-hairline bg-white px-4 py-3">
      <Button id={addButtonId} variant="secondary" onClick={onAdd}>
        <Plus aria-hidden="true" className="size-4" />
        {addLabel}
      </Button>
      <SubmitButton label={saveLabel} isPending={isSaving} />
      <Button variant="secondary" disabled={!hasUnsavedChanges || isSaving} onClick={onDiscard}>
        <RotateCcw aria-hidden="true" className="size-4" />
        Discard changes
      </Button>
      <p className="ml-auto flex items-center gap-1.5 text-sm">
        <span className="font-mono font-semibold">{rowCount}</span>
        {rowCount === 1 ? rowNoun[0] : rowNoun[1]}
        {hasUnsavedChanges ? (
          <span className="ml-2 inline-flex items-center gap-1 font-medium text-fault-text">
            <CircleDot aria-hidden="true" className="size-4" />
            Unsaved changes
          </span>
        ) : isSaved ? (
          <span className="ml-2 inline-flex items-center gap-1 font-medium text-normal">
            <CircleCheck aria-hidden="true" className="size-4" />
            Saved
          </span>
        ) : null}
      </p>
    </div>
  );
}
