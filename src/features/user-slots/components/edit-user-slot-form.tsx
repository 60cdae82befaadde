import { zodResolver } from '@hookform/resolvers/zod';
import {
  updateUserSlotSchema,
  type UpdateUserSlotInput,
  type UserSlot,
} from '@server/user-slots/schema';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { InPlaceRecordForm } from '@/components/forms/in-place-record-form';
import { getUserSlotsQueryOptions } from '@/features/user-slots/api/get-user-slots';
import { useUpdateUserSlot } from '@/features/user-slots/api/update-user-slot';
import { UserSlotFields } from '@/features/user-slots/components/user-slot-fields';
import { isUserSlotField } from '@/features/user-slots/components/user-slot-form-values';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { useReloadLatest } from '@/lib/use-reload-latest';

// Homeowners may not change a slot's level, so for them the level is not sent at all.
function toFormValues(slot: UserSlot, canChooseLevel: boolean): UpdateUserSlotInput {
  return {
    holderName: slot.holderName,
    ...(canChooseLevel && (slot.accessLevel === 2 || slot.accessLevel === 3)
      ? { accessLevel: slot.accessLevel }
      : {}),
    areaNumbers: slot.areaNumbers,
    validFrom: slot.validFrom,
    validTo: slot.validTo,
    version: slot.version,
  };
}

type EditUserSlotFormProps = {
  siteId: string;
  slot: UserSlot;
  headingId: string;
  canChooseLevel: boolean;
  onSaved: (slot: UserSlot) => void;
  onCancel: () => void;
};

export function EditUserSlotForm({
  siteId,
  slot,
  headingId,
  canChooseLevel,
  onSaved,
  onCancel,
}: EditUserSlotFormProps) {
  const queryClient = useQueryClient();
  const form = useForm<UpdateUserSlotInput, unknown, z.output<typeof updateUserSlotSchema>>({
    resolver: zodResolver(updateUserSlotSchema),
    defaultValues: toFormValues(slot, canChooseLevel),
  });
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [reloadMessage, setReloadMessage] = useState('');
  const updateUserSlot = useUpdateUserSlot({
    mutationConfig: {
      onSuccess: (saved) => onSaved(saved),
      onError: (error) =>
        setUnplacedMessages(applyServerFieldErrors(error, form.setError, isUserSlotField)),
    },
  });

  const { isReloading, reloadLatest } = useReloadLatest(async () => {
    const slots = await queryClient.fetchQuery({
      ...getUserSlotsQueryOptions(siteId),
      staleTime: 0,
    });
    const latest = slots.find((candidate) => candidate.id === slot.id);
    updateUserSlot.reset();
    if (latest) {
      form.reset(toFormValues(latest, canChooseLevel));
      setReloadMessage('The form now shows the latest saved details.');
    } else {
      setReloadMessage('Someone else has deleted this slot.');
    }
  });

  return (
    <InPlaceRecordForm
      form={form}
      headingId={headingId}
      firstField="holderName"
      onSubmit={(data) => {
        setUnplacedMessages([]);
        setReloadMessage('');
        updateUserSlot.mutate({ siteId, slotId: slot.id, data });
      }}
      subject={`Slot ${slot.slot}`}
      error={updateUserSlot.error}
      unplacedMessages={unplacedMessages}
      onReloadLatest={reloadLatest}
      isReloading={isReloading}
      saveLabel="Save changes"
      isSaving={updateUserSlot.isPending}
      onCancel={onCancel}
      statusMessage={reloadMessage}
    >
      <UserSlotFields
        showSlotNumber={false}
        accessLevel={canChooseLevel ? 'choose' : 'unchanged'}
      />
    </InPlaceRecordForm>
  );
}
