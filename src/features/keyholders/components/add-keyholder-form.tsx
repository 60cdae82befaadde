import { zodResolver } from '@hookform/resolvers/zod';
import {
  createKeyholderSchema,
  type CreateKeyholderInput,
  type Keyholder,
} from '@server/keyholders/schema';
import { useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { InPlaceRecordForm } from '@/components/forms/in-place-record-form';
import { useCreateKeyholder } from '@/features/keyholders/api/create-keyholder';
import { KeyholderFields } from '@/features/keyholders/components/keyholder-fields';
import { isKeyholderField } from '@/features/keyholders/components/keyholder-form-values';
import { applyServerFieldErrors } from '@/lib/form-errors';

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

  return (
    <InPlaceRecordForm
      form={form}
      headingId={headingId}
      firstField="name"
      onSubmit={(data) => {
        setUnplacedMessages([]);
        createKeyholder.mutate({ siteId, data });
      }}
      subject="The keyholder"
      error={createKeyholder.error}
      unplacedMessages={unplacedMessages}
      saveLabel="Save keyholder"
      isSaving={createKeyholder.isPending}
      onCancel={onCancel}
    >
      <KeyholderFields />
    </InPlaceRecordForm>
  );
}
