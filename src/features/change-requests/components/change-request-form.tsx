import { zodResolver } from '@hookform/resolvers/zod';
import {
  createChangeRequestSchema,
  type ChangeRequest,
  type CreateChangeRequestInput,
} from '@server/change-requests/schema';
import { Send } from 'lucide-react';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { LoadingStatus } from '@/components/ui/loading-status';
import { touchInputClassName, touchTextareaClassName } from '@/components/ui/touch-field-styles';
import { useCreateChangeRequest } from '@/features/change-requests/api/create-change-request';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';

const fieldNames: ReadonlyArray<string> = ['subject', 'details'];

type ChangeRequestFormProps = { siteId: string };

/** A homeowner asks their alarm company to change something about the system. */
export function ChangeRequestForm({ siteId }: ChangeRequestFormProps) {
  const headingId = useId();
  const form = useForm<
    CreateChangeRequestInput,
    unknown,
    z.output<typeof createChangeRequestSchema>
  >({
    resolver: zodResolver(createChangeRequestSchema),
    defaultValues: { subject: '', details: '' },
  });
  const {
    register,
    formState: { errors, submitCount },
  } = form;
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [sentSubject, setSentSubject] = useState('');
  const createRequest = useCreateChangeRequest({
    mutationConfig: {
      onSuccess: (sent: ChangeRequest) => {
        form.reset();
        setSentSubject(sent.subject);
      },
      onError: (error) =>
        setUnplacedMessages(
          applyServerFieldErrors(error, form.setError, (path) => fieldNames.includes(path)),
        ),
    },
  });

  return (
    <section aria-labelledby={headingId} className="rounded-lg border border-hairline bg-white">
      <h2
        id={headingId}
        className="border-b border-hairline px-4 py-3 text-base font-semibold md:px-5"
      >
        Ask your alarm company for a change
      </h2>
      <form
        noValidate
        onSubmit={form.handleSubmit((data) => {
          setUnplacedMessages([]);
          setSentSubject('');
          createRequest.mutate({ siteId, data });
        })}
        className="grid gap-4 px-4 py-4 md:px-5"
      >
        <p className="text-ink-muted">
          For example a new detector, moving a keypad, or a change to when the system is monitored.
          Your alarm company will contact you to arrange it. Please do not move, open or rewire
          alarm equipment yourself.
        </p>
        <FormProblem
          subject="Your request"
          fieldErrorCount={submitCount > 0 ? countFieldErrors(errors) : 0}
          error={createRequest.error}
          unplacedMessages={unplacedMessages}
        />
        <FormField label="Subject" error={errors.subject?.message}>
          {(fieldProps) => (
            <input
              {...fieldProps}
              {...register('subject')}
              type="text"
              maxLength={120}
              className={touchInputClassName({ invalid: Boolean(errors.subject) })}
            />
          )}
        </FormField>
        <FormField
          label="Details"
          hint="What you would like changed, where, and any times that suit you for a visit."
          error={errors.details?.message}
        >
          {(fieldProps) => (
            <textarea
              {...fieldProps}
              {...register('details')}
              rows={6}
              className={touchTextareaClassName({ invalid: Boolean(errors.details) })}
            />
          )}
        </FormField>
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit" size="lg" disabled={createRequest.isPending}>
            <Send aria-hidden="true" className="size-5" />
            Send request
          </Button>
          {createRequest.isPending ? <LoadingStatus label="Sending" /> : null}
        </div>
        <p role="status" className="font-semibold text-normal">
          {sentSubject ? `Sent: “${sentSubject}”. It now shows in the list below as open.` : ''}
        </p>
      </form>
    </section>
  );
}
