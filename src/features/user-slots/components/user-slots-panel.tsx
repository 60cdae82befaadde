import { KeyRound, ShieldCheck } from 'lucide-react';
import { useRef, useState } from 'react';

import { AddInPlace } from '@/components/forms/add-in-place';
import { Card } from '@/components/ui/card';
import { LiveMessage } from '@/components/ui/live-message';
import { Notice } from '@/components/ui/notice';
import { useUserSlots } from '@/features/user-slots/api/get-user-slots';
import { AddUserSlotForm } from '@/features/user-slots/components/add-user-slot-form';
import { UserSlotItem } from '@/features/user-slots/components/user-slot-item';
import { lowestFreeNumber } from '@/lib/lowest-free-number';

/** Installer staff may record engineer slots and delete records; homeowners name and deactivate. */
export type UserSlotViewer = 'engineer' | 'office' | 'homeowner';

type UserSlotsPanelProps = { siteId: string; viewer: UserSlotViewer };

/** Who holds each user-code slot on the control panel, and never the codes themselves. */
export function UserSlotsPanel({ siteId, viewer }: UserSlotsPanelProps) {
  const { data: slots } = useUserSlots(siteId);
  const addButtonRef = useRef<HTMLButtonElement>(null);
  const [message, setMessage] = useState('');
  const isStaff = viewer !== 'homeowner';

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

      <AddInPlace
        addLabel="Add user-code slot"
        formTitle="New user-code slot"
        addButtonRef={addButtonRef}
      >
        {({ headingId, close }) => (
          <AddUserSlotForm
            siteId={siteId}
            headingId={headingId}
            canChooseLevel={isStaff}
            suggestedSlot={lowestFreeNumber(slots.map((slot) => slot.slot))}
            onAdded={(added) => {
              setMessage(`Slot ${added.slot} recorded for ${added.holderName}.`);
              close();
            }}
            onCancel={close}
          />
        )}
      </AddInPlace>
      <LiveMessage message={message} />
    </Card>
  );
}
