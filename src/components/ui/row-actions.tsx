import { ArrowDown, ArrowUp, Copy, Trash2 } from 'lucide-react';

import { Button } from '@/components/ui/button';
import { rowActionIds } from '@/components/ui/row-action-ids';

type RowActionsProps = {
  /** How the row is named in the buttons' accessible names: "zone 3", "device 2". */
  itemName: string;
  /** Prefix for the buttons' ids, so focus can be put back on them after the row moves. */
  idPrefix: string;
  isFirst: boolean;
  isLast: boolean;
  onMoveUp: () => void;
  onMoveDown: () => void;
  onDuplicate?: () => void;
  onRemove: () => void;
};

const iconButton = 'min-w-9 px-2';

/**
 * Reordering by buttons rather than dragging, so it works from a keyboard and a switch device
 * (WCAG 2.2 2.5.7). The words sit in each button's name; on wide screens they are also visible.
 */
export function RowActions({
  itemName,
  idPrefix,
  isFirst,
  isLast,
  onMoveUp,
  onMoveDown,
  onDuplicate,
  onRemove,
}: RowActionsProps) {
  const ids = rowActionIds(idPrefix);
  return (
    <div className="flex flex-wrap items-center gap-1">
      <Button
        id={ids.up}
        variant="secondary"
        className={iconButton}
        aria-label={`Move ${itemName} up`}
        title={`Move ${itemName} up`}
        disabled={isFirst}
        onClick={onMoveUp}
      >
        <ArrowUp aria-hidden="true" className="size-4" />
      </Button>
      <Button
        id={ids.down}
        variant="secondary"
        className={iconButton}
        aria-label={`Move ${itemName} down`}
        title={`Move ${itemName} down`}
        disabled={isLast}
        onClick={onMoveDown}
      >
        <ArrowDown aria-hidden="true" className="size-4" />
      </Button>
      {onDuplicate ? (
        <Button
          id={ids.duplicate}
          variant="secondary"
          className={iconButton}
          aria-label={`Duplicate ${itemName}`}
          title={`Duplicate ${itemName}`}
          onClick={onDuplicate}
        >
          <Copy aria-hidden="true" className="size-4" />
          <span aria-hidden="true" className="hidden lg:inline">
            Duplicate
          </span>
        </Button>
      ) : null}
      <Button
        id={ids.remove}
        variant="secondary"
        className={iconButton}
        aria-label={`Remove ${itemName}`}
        title={`Remove ${itemName}`}
        onClick={onRemove}
      >
        <Trash2 aria-hidden="true" className="size-4" />
        <span aria-hidden="true" className="hidden lg:inline">
          Remove
        </span>
      </Button>
    </div>
  );
}
