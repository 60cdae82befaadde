import { zodResolver } from '@hookform/resolvers/zod';
import {
  createUserSlotSchema,
  type CreateUserSlotInput,
  type UserSlot,
} from '@server/user-slots/schema';
import { useEffect, useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { FormProblem } from '@/components/ui/form-problem';
import { LoadingStatus } from '@/components/ui/loading-status';
import { useCreateUserSlot } from '@/features/user-slots/api/create-user-slot';
import { UserSlotFields } from '@/features/user-slots/components/user-slot-fields';
import { isUserSlotField } from '@/features/user-slots/components/user-slot-form-values';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';

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
  const { setFocus } = form;

  useEffect(() => setFocus('holderName'), [setFocus]);

  return (
    <FormProvider {...form}>
      <form
        noValidate
        aria-labelledby={headingId}
        onSubmit={form.handleSubmit((data) => {
          setUnplacedMessages([]);
          createUserSlot.mutate({ siteId, data });
        })}
        className="grid gap-5"
      >
        <FormProblem
          subject="The slot"
          fieldErrorCount={
            form.formState.submitCount > 0 ? countFieldErrors(form.formState.errors) : 0
          }
          error={createUserSlot.error}
          unplacedMessages={unplacedMessages}
        />
        <UserSlotFields showSlotNumber accessLevel={canChooseLevel ? 'choose' : 'user-only'} />
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" size="lg" disabled={createUserSlot.isPending}>
            Save slot
          </Button>
          <Button variant="secondary" size="lg" onClick={onCancel}>
            Cancel
          </Button>
          {createUserSlot.isPending ? <LoadingStatus label="Saving" /> : null}
        </div>
      </form>
    </FormProvider>
  );
}
