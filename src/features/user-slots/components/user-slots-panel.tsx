import type { UserSlot } from '@server/user-slots/schema';
import { KeyRound, Plus, ShieldCheck } from 'lucide-react';
import { useEffect, useId, useRef, useState } from 'react';

import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { LiveMessage } from '@/components/ui/live-message';
import { Notice } from '@/components/ui/notice';
import { useUserSlots } from '@/features/user-slots/api/get-user-slots';
import { AddUserSlotForm } from '@/features/user-slots/components/add-user-slot-form';
import { UserSlotItem } from '@/features/user-slots/components/user-slot-item';

/** Installer staff may record engineer slots and delete records; homeowners name and deactivate. */
export type UserSlotViewer = 'engineer' | 'office' | 'homeowner';

type UserSlotsPanelProps = { siteId: string; viewer: UserSlotViewer };

function nextFreeSlot(slots: readonly UserSlot[]): number {
  const used = new Set(slots.map((slot) => slot.slot));
  let candidate = 1;
  while (used.has(candidate)) candidate += 1;
  return candidate;
}

/** Who holds each user-code slot on the control panel, and never the codes themselves. */
export function UserSlotsPanel({ siteId, viewer }: UserSlotsPanelProps) {
  const { data: slots } = useUserSlots(siteId);
  const [isAdding, setIsAdding] = useState(false);
  const [message, setMessage] = useState('');
  const addHeadingId = useId();
  const addButtonRef = useRef<HTMLButtonElement>(null);
  const focusAddButton = useRef(false);
  const isStaff = viewer !== 'homeowner';

  useEffect(() => {
    if (!isAdding && focusAddButton.current) {
      focusAddButton.current = false;
      addButtonRef.current?.focus();
    }
  }, [isAdding]);

  const closeAddForm = () => {
    focusAddButton.current = true;
    setIsAdding(false);
  };

  return (
    <Card title="User-code slots" icon={KeyRound} flush>
      <div className="border-b border-hairline px-4 py-4 md:px-5">
        <Notice
          tone="info"
          icon={ShieldCheck}
          title="Wardbook never asks for, stores or sends alarm codes. Codes are set at the keypad."
        >
          This list records only who holds each slot on the control panel, their access level and
          when they may use it. To give someone a code, change one or take one away, use the keypad
          as your user guide explains, then record the holder here.
        </Notice>
      </div>

      {slots.length > 0 ? (
        <ul aria-label="User-code slots" className="divide-y divide-hairline">
          {slots.map((slot) => (
            <UserSlotItem
              key={slot.id}
              siteId={siteId}
              slot={slot}
              isStaff={isStaff}
              announce={setMessage}
              onDeleted={(deleted) => {
                setMessage(`The record of slot ${deleted.slot} was deleted.`);
                addButtonRef.current?.focus();
              }}
            />
          ))}
        </ul>
      ) : (
        <p className="px-4 py-4 text-ink-muted md:px-5">No slots are recorded yet.</p>
      )}

      <div className="border-t border-hairline bg-paper px-4 py-5 md:px-5">
        {isAdding ? (
          <section aria-labelledby={addHeadingId} className="grid gap-4">
            <h3 id={addHeadingId} className="text-lg font-semibold">
              New user-code slot
            </h3>
            <AddUserSlotForm
              siteId={siteId}
              headingId={addHeadingId}
              canChooseLevel={isStaff}
              suggestedSlot={nextFreeSlot(slots)}
              onAdded={(added) => {
                setMessage(`Slot ${added.slot} recorded for ${added.holderName}.`);
                closeAddForm();
              }}
              onCancel={closeAddForm}
            />
          </section>
        ) : (
          <Button ref={addButtonRef} size="lg" onClick={() => setIsAdding(true)}>
            <Plus aria-hidden="true" className="size-5" />
            Add user-code slot
          </Button>
        )}
      </div>
      <LiveMessage message={message} />
    </Card>
  );
}
