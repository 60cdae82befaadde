import { zodResolver } from '@hookform/resolvers/zod';
import {
  updateUserSlotSchema,
  type UpdateUserSlotInput,
  type UserSlot,
} from '@server/user-slots/schema';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { FormProblem } from '@/components/ui/form-problem';
import { LoadingStatus } from '@/components/ui/loading-status';
import { getUserSlotsQueryOptions } from '@/features/user-slots/api/get-user-slots';
import { useUpdateUserSlot } from '@/features/user-slots/api/update-user-slot';
import { UserSlotFields } from '@/features/user-slots/components/user-slot-fields';
import { isUserSlotField } from '@/features/user-slots/components/user-slot-form-values';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';

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
  const [isReloading, setIsReloading] = useState(false);
  const [reloadMessage, setReloadMessage] = useState('');
  const updateUserSlot = useUpdateUserSlot({
    mutationConfig: {
      onSuccess: (saved) => onSaved(saved),
      onError: (error) =>
        setUnplacedMessages(applyServerFieldErrors(error, form.setError, isUserSlotField)),
    },
  });
  const { setFocus } = form;

  useEffect(() => setFocus('holderName'), [setFocus]);

  const reloadLatest = async () => {
    setIsReloading(true);
    try {
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
    } finally {
      setIsReloading(false);
    }
  };

  return (
    <FormProvider {...form}>
      <form
        noValidate
        aria-labelledby={headingId}
        onSubmit={form.handleSubmit((data) => {
          setUnplacedMessages([]);
          setReloadMessage('');
          updateUserSlot.mutate({ siteId, slotId: slot.id, data });
        })}
        className="grid gap-5"
      >
        <FormProblem
          subject={`Slot ${slot.slot}`}
          fieldErrorCount={
            form.formState.submitCount > 0 ? countFieldErrors(form.formState.errors) : 0
          }
          error={updateUserSlot.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={() => void reloadLatest()}
          isReloading={isReloading}
        />
        <UserSlotFields
          showSlotNumber={false}
          accessLevel={canChooseLevel ? 'choose' : 'unchanged'}
        />
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" size="lg" disabled={updateUserSlot.isPending}>
            Save changes
          </Button>
          <Button variant="secondary" size="lg" onClick={onCancel}>
            Cancel
          </Button>
          {updateUserSlot.isPending ? <LoadingStatus label="Saving" /> : null}
          <p role="status" className="font-semibold">
            {reloadMessage}
          </p>
        </div>
      </form>
    </FormProvider>
  );
}
