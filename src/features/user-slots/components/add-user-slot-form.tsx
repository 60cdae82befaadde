import { zodResolver } from '@hookform/resolvers/zod';
import {
  createUserSlotSchema,
  type CreateUserSlotInput,
  type UserSlot,
} from '@server/user-slots/schema';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { InPlaceRecordForm } from '@/components/forms/in-place-record-form';
import { useCreateUserSlot } from '@/features/user-slots/api/create-user-slot';
import { UserSlotFields } from '@/features/user-slots/components/user-slot-fields';
import { isUserSlotField } from '@/features/user-slots/components/user-slot-form-values';
import { applyServerFieldErrors } from '@/lib/form-errors';

type AddUserSlotFormProps = {
  siteId: string;
  headingId: string;
  canChooseLevel: boolean;
  suggestedSlot: number;
  onAdded: (slot: UserSlot) => void;
  onCancel: () => void;
};

export function AddUserSlotForm({
  siteId,
  headingId,
  canChooseLevel,
  suggestedSlot,
  onAdded,
  onCancel,
}: AddUserSlotFormProps) {
  const form = useForm<CreateUserSlotInput, unknown, z.output<typeof createUserSlotSchema>>({
    resolver: zodResolver(createUserSlotSchema),
    defaultValues: {
      slot: suggestedSlot,
      holderName: '',
      accessLevel: 2,
      areaNumbers: [],
      validFrom: null,
      validTo: null,
    },
  });
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const createUserSlot = useCreateUserSlot({
    mutationConfig: {
      onSuccess: (slot) => onAdded(slot),
      onError: (error) =>
        setUnplacedMessages(applyServerFieldErrors(error, form.setError, isUserSlotField)),
    },
  });

  return (
    <InPlaceRecordForm
      form={form}
      headingId={headingId}
      firstField="holderName"
      onSubmit={(data) => {
        setUnplacedMessages([]);
        createUserSlot.mutate({ siteId, data });
      }}
      subject="The slot"
      error={createUserSlot.error}
      unplacedMessages={unplacedMessages}
      saveLabel="Save slot"
      isSaving={createUserSlot.isPending}
      onCancel={onCancel}
    >
      <UserSlotFields showSlotNumber accessLevel={canChooseLevel ? 'choose' : 'user-only'} />
    </InPlaceRecordForm>
  );
}
