import { zodResolver } from '@hookform/resolvers/zod';
import {
  updateKeyholderSchema,
  type Keyholder,
  type UpdateKeyholderInput,
} from '@server/keyholders/schema';
import { useQueryClient } from '@tanstack/react-query';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { InPlaceRecordForm } from '@/components/forms/in-place-record-form';
import { getKeyholdersQueryOptions } from '@/features/keyholders/api/get-keyholders';
import { useUpdateKeyholder } from '@/features/keyholders/api/update-keyholder';
import { KeyholderFields } from '@/features/keyholders/components/keyholder-fields';
import { isKeyholderField } from '@/features/keyholders/components/keyholder-form-values';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { useReloadLatest } from '@/lib/use-reload-latest';

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
  const [reloadMessage, setReloadMessage] = useState('');
  const updateKeyholder = useUpdateKeyholder({
    mutationConfig: {
      onSuccess: (saved) => onSaved(saved),
      onError: (error) =>
        setUnplacedMessages(applyServerFieldErrors(error, form.setError, isKeyholderField)),
    },
  });

  // After a 409 the person may drop their typing for what is saved now, new version included.
  const { isReloading, reloadLatest } = useReloadLatest(async () => {
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
  });

  return (
    <InPlaceRecordForm
      form={form}
      headingId={headingId}
      firstField="name"
      onSubmit={(data) => {
        setUnplacedMessages([]);
        setReloadMessage('');
        updateKeyholder.mutate({ siteId, keyholderId: keyholder.id, data });
      }}
      subject={`${keyholder.name}'s entry`}
      error={updateKeyholder.error}
      unplacedMessages={unplacedMessages}
      onReloadLatest={reloadLatest}
      isReloading={isReloading}
      saveLabel="Save changes"
      isSaving={updateKeyholder.isPending}
      onCancel={onCancel}
      statusMessage={reloadMessage}
    >
      <KeyholderFields />
    </InPlaceRecordForm>
  );
}
