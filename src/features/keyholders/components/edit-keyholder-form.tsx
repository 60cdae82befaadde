import { zodResolver } from '@hookform/resolvers/zod';
import {
  updateKeyholderSchema,
  type Keyholder,
  type UpdateKeyholderInput,
} from '@server/keyholders/schema';
import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useState } from 'react';
import { FormProvider, useForm } from 'react-hook-form';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { FormProblem } from '@/components/ui/form-problem';
import { LoadingStatus } from '@/components/ui/loading-status';
import { getKeyholdersQueryOptions } from '@/features/keyholders/api/get-keyholders';
import { useUpdateKeyholder } from '@/features/keyholders/api/update-keyholder';
import { KeyholderFields } from '@/features/keyholders/components/keyholder-fields';
import { isKeyholderField } from '@/features/keyholders/components/keyholder-form-values';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';

function toFormValues(keyholder: Keyholder): UpdateKeyholderInput {
  return {
    name: keyholder.name,
    phone: keyholder.phone,
    email: keyholder.email,
    relation: keyholder.relation,
    minutesToAttend: keyholder.minutesToAttend,
    unavailable: keyholder.unavailable,
    version: keyholder.version,
  };
}

type EditKeyholderFormProps = {
  siteId: string;
  keyholder: Keyholder;
  headingId: string;
  onSaved: (keyholder: Keyholder) => void;
  onCancel: () => void;
};

export function EditKeyholderForm({
  siteId,
  keyholder,
  headingId,
  onSaved,
  onCancel,
}: EditKeyholderFormProps) {
  const queryClient = useQueryClient();
  const form = useForm<UpdateKeyholderInput, unknown, z.output<typeof updateKeyholderSchema>>({
    resolver: zodResolver(updateKeyholderSchema),
    defaultValues: toFormValues(keyholder),
  });
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const { setFocus } = form;

  useEffect(() => setFocus('name'), [setFocus]);

  const [isReloading, setIsReloading] = useState(false);
  const [reloadMessage, setReloadMessage] = useState('');
  const updateKeyholder = useUpdateKeyholder({
    mutationConfig: {
      onSuccess: (saved) => onSaved(saved),
      onError: (error) =>
        setUnplacedMessages(applyServerFieldErrors(error, form.setError, isKeyholderField)),
    },
  });

  // After a 409 the person may drop their typing for what is saved now, new version included.
  const reloadLatest = async () => {
    setIsReloading(true);
    try {
      const keyholders = await queryClient.fetchQuery({
        ...getKeyholdersQueryOptions(siteId),
        staleTime: 0,
      });
      const latest = keyholders.find((candidate) => candidate.id === keyholder.id);
      updateKeyholder.reset();
      if (latest) {
        form.reset(toFormValues(latest));
        setReloadMessage('The form now shows the latest saved details.');
      } else {
        setReloadMessage('Someone else has removed this keyholder from the call plan.');
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
          updateKeyholder.mutate({ siteId, keyholderId: keyholder.id, data });
        })}
        className="grid gap-5"
      >
        <FormProblem
          subject={`${keyholder.name}'s entry`}
          fieldErrorCount={
            form.formState.submitCount > 0 ? countFieldErrors(form.formState.errors) : 0
          }
          error={updateKeyholder.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={() => void reloadLatest()}
          isReloading={isReloading}
        />
        <KeyholderFields />
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" size="lg" disabled={updateKeyholder.isPending}>
            Save changes
          </Button>
          <Button variant="secondary" size="lg" onClick={onCancel}>
            Cancel
          </Button>
          {updateKeyholder.isPending ? <LoadingStatus label="Saving" /> : null}
          <p role="status" className="font-semibold">
            {reloadMessage}
          </p>
        </div>
      </form>
    </FormProvider>
  );
}
