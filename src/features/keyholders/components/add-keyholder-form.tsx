import { zodResolver } from '@hookform/resolvers/zod';
import {
  createKeyholderSchema,
  type CreateKeyholderInput,
  type Keyholder,
} from '@server/keyholders/schema';
import { useEffect, useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { FormProblem } from '@/components/ui/form-problem';
import { LoadingStatus } from '@/components/ui/loading-status';
import { useCreateKeyholder } from '@/features/keyholders/api/create-keyholder';
import { KeyholderFields } from '@/features/keyholders/components/keyholder-fields';
import { isKeyholderField } from '@/features/keyholders/components/keyholder-form-values';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';

type AddKeyholderFormProps = {
  siteId: string;
  headingId: string;
  onAdded: (keyholder: Keyholder) => void;
  onCancel: () => void;
};

export function AddKeyholderForm({ siteId, headingId, onAdded, onCancel }: AddKeyholderFormProps) {
  const form = useForm<CreateKeyholderInput, unknown, z.output<typeof createKeyholderSchema>>({
    resolver: zodResolver(createKeyholderSchema),
    defaultValues: { name: '', phone: '', email: null, relation: '', unavailable: [] },
  });
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const createKeyholder = useCreateKeyholder({
    mutationConfig: {
      onSuccess: (keyholder) => onAdded(keyholder),
      onError: (error) =>
        setUnplacedMessages(applyServerFieldErrors(error, form.setError, isKeyholderField)),
    },
  });
  const { setFocus } = form;

  // The form opens from the "Add keyholder" button; typing starts at once in the first field.
  useEffect(() => setFocus('name'), [setFocus]);

  return (
    <FormProvider {...form}>
      <form
        noValidate
        aria-labelledby={headingId}
        onSubmit={form.handleSubmit((data) => {
          setUnplacedMessages([]);
          createKeyholder.mutate({ siteId, data });
        })}
        className="grid gap-5"
      >
        <FormProblem
          subject="The keyholder"
          fieldErrorCount={
            form.formState.submitCount > 0 ? countFieldErrors(form.formState.errors) : 0
          }
          error={createKeyholder.error}
          unplacedMessages={unplacedMessages}
        />
        <KeyholderFields />
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" size="lg" disabled={createKeyholder.isPending}>
            Save keyholder
          </Button>
          <Button variant="secondary" size="lg" onClick={onCancel}>
            Cancel
          </Button>
          {createKeyholder.isPending ? <LoadingStatus label="Saving" /> : null}
        </div>
      </form>
    </FormProvider>
  );
}
