import type { UserSlot } from '@server/user-slots/schema';
import { CircleCheck, CircleSlash, Pencil, RotateCcw } from 'lucide-react';
import { useQueryClient } from '@tanstack/react-query';
import { useRef } from 'react';

import { InPlaceFormSection } from '@/components/forms/in-place-form-section';
import { Button } from '@/components/ui/button';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { DetailItem } from '@/components/ui/detail-item';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { getUserSlotsQueryKey } from '@/features/user-slots/api/get-user-slots';
import { useDeleteUserSlot } from '@/features/user-slots/api/delete-user-slot';
import { useUpdateUserSlot } from '@/features/user-slots/api/update-user-slot';
import { EditUserSlotForm } from '@/features/user-slots/components/edit-user-slot-form';
import { ACCESS_LEVEL_LABELS } from '@/features/user-slots/components/user-slot-form-values';
import { formatCalendarDate } from '@/lib/dates';
import { useInPlaceForm } from '@/lib/use-in-place-form';
import { formatDateTime } from '@/utils/format';

type UserSlotItemProps = {
  siteId: string;
  slot: UserSlot;
  isStaff: boolean;
  announce: (message: string) => void;
  onDeleted: (slot: UserSlot) => void;
};

function describeValidity(slot: UserSlot): string {
  if (slot.validFrom && slot.validTo) {
    return `${formatCalendarDate(slot.validFrom)} to ${formatCalendarDate(slot.validTo)}`;
  }
  if (slot.validFrom) return `From ${formatCalendarDate(slot.validFrom)}`;
  if (slot.validTo) return `Until ${formatCalendarDate(slot.validTo)}`;
  return 'No time limit';
}

export function UserSlotItem({ siteId, slot, isStaff, announce, onDeleted }: UserSlotItemProps) {
  const queryClient = useQueryClient();
  const editButtonRef = useRef<HTMLButtonElement>(null);
  const { isOpen: isEditing, open: openEditor, close: closeEditor } = useInPlaceForm(editButtonRef);
  const label = `slot ${slot.slot} (${slot.holderName})`;

  const setActive = useUpdateUserSlot({
    mutationConfig: {
      // A refusal usually means the list on screen is out of date (409): show the latest.
      onError: () => queryClient.invalidateQueries({ queryKey: getUserSlotsQueryKey(siteId) }),
      onSuccess: (saved) => {
        // The Deactivate question has gone with the change; carry on from the Edit button.
        editButtonRef.current?.focus();
        announce(
          saved.active
            ? `Slot ${saved.slot} is recorded as active again.`
            : `Slot ${saved.slot} is recorded as deactivated. Delete the code at the keypad too.`,
        );
      },
    },
  });
  const recordActive = (active: boolean) =>
    setActive.mutate({ siteId, slotId: slot.id, data: { active, version: slot.version } });
  const deleteUserSlot = useDeleteUserSlot({
    mutationConfig: { onSuccess: () => onDeleted(slot) },
  });
  const failedAction = [setActive, deleteUserSlot].find((mutation) => mutation.isError);

  return (
    <li className="grid gap-4 px-4 py-5 md:px-5">
      <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h3 className="text-lg font-semibold">
          <span className="font-mono">Slot {slot.slot}</span>: {slot.holderName}
        </h3>
        {slot.active ? (
          <span className="inline-flex items-center gap-1.5 font-semibold text-normal">
            <CircleCheck aria-hidden="true" className="size-4 shrink-0" />
            Active
          </span>
        ) : (
          <span className="inline-flex items-center gap-1.5 font-semibold text-ink-muted">
            <CircleSlash aria-hidden="true" className="size-4 shrink-0" />
            Deactivated
          </span>
        )}
      </div>

      {isEditing ? (
        <InPlaceFormSection title={`Change slot ${slot.slot}`} headingLevel={4}>
          {(headingId) => (
            <EditUserSlotForm
              siteId={siteId}
              slot={slot}
              headingId={headingId}
              canChooseLevel={isStaff}
              onSaved={(saved) => {
                closeEditor();
                announce(`Saved slot ${saved.slot}.`);
              }}
              onCancel={closeEditor}
            />
          )}
        </InPlaceFormSection>
      ) : (
        <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2 lg:grid-cols-4">
          <DetailItem term="Access level">
            {ACCESS_LEVEL_LABELS[slot.accessLevel] ?? `Level ${slot.accessLevel}`}
          </DetailItem>
          <DetailItem term="Areas">
            {slot.areaNumbers.length > 0 ? (
              <span className="font-mono">{slot.areaNumbers.join(', ')}</span>
            ) : (
              'Not recorded'
            )}
          </DetailItem>
          <DetailItem term="Valid">{describeValidity(slot)}</DetailItem>
          <DetailItem term="Last changed">
            {slot.changedBy ?? 'Wardbook'},{' '}
            <time dateTime={slot.changedAt}>{formatDateTime(slot.changedAt)}</time>
          </DetailItem>
        </dl>
      )}

      {failedAction ? <ProblemAlert error={failedAction.error} /> : null}

      {isEditing ? null : (
        <div className="flex flex-wrap gap-2">
          <Button ref={editButtonRef} variant="secondary" size="lg" onClick={openEditor}>
            <Pencil aria-hidden="true" className="size-5" />
            Edit <span className="sr-only">{label}</span>
          </Button>
          {slot.active ? (
            <ConfirmButton
              size="lg"
              question={`Record slot ${slot.slot} as no longer in use? This does not stop the code working: delete it at the keypad as well.`}
              confirmLabel="Yes, deactivate"
              cancelLabel="Keep it active"
              pending={setActive.isPending}
              onConfirm={() => recordActive(false)}
            >
              <CircleSlash aria-hidden="true" className="size-5" />
              Deactivate <span className="sr-only">{label}</span>
            </ConfirmButton>
          ) : isStaff ? (
            <Button
              variant="secondary"
              size="lg"
              disabled={setActive.isPending}
              onClick={() => recordActive(true)}
            >
              <RotateCcw aria-hidden="true" className="size-5" />
              Reactivate <span className="sr-only">{label}</span>
            </Button>
          ) : null}
          {isStaff ? (
            <ConfirmButton
              size="lg"
              question={`Delete the record of slot ${slot.slot}? Its history stays in the audit log; the code itself is managed at the keypad.`}
              confirmLabel="Yes, delete"
              cancelLabel="Keep it"
              pending={deleteUserSlot.isPending}
              onConfirm={() => deleteUserSlot.mutate({ siteId, slotId: slot.id })}
            >
              Delete <span className="sr-only">{label}</span>
            </ConfirmButton>
          ) : null}
        </div>
      )}
    </li>
  );
}
