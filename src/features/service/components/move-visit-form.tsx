import { zodResolver } from '@hookform/resolvers/zod';
import type { ServiceVisit } from '@server/service/schema';
import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';

import { SubmitButton } from '@/components/forms/submit-button';
import { FormField } from '@/components/ui/form-field';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';
import { useUpdateVisit } from '@/features/service/api/update-visit';
import { VisitSaveProblem } from '@/features/service/components/visit-save-problem';
import {
  moveFormValuesOf,
  moveVisitFormSchema,
  placeVisitFieldErrors,
  toMoveInput,
  type MoveVisitFormValues,
} from '@/features/service/utils/visit-form-values';
import { describeBooking } from '@/features/service/utils/visit-words';
import { countFieldErrors } from '@/lib/form-errors';
import { useReloadLatest } from '@/lib/use-reload-latest';
export type EngineerChoice = { id: string; displayName: string };

function describeAssignment(visit: ServiceVisit): string {
  const engineer = visit.engineer ? visit.engineer.name : 'no engineer yet';
  return `${engineer}, ${visit.scheduledFor ? describeBooking(visit.scheduledFor) : 'no day booked yet'}`;
}

const SHOWN_FIELDS = ['engineerId', 'day'] as const;

type MoveVisitFormProps = {
  /** The visit as saved now; after someone else's change it is their version. */
  visit: ServiceVisit;
  engineers: readonly EngineerChoice[];
  /** Fetches what is saved now, for "Reload latest". */
  reloadVisit: () => Promise<ServiceVisit | undefined>;
  onMoved: (visit: ServiceVisit) => void;
};

/**
 * The office sends an engineer or moves the visit to another day and time. The form starts from
 * the visit as it was when opened and keeps what is typed until the person saves or reloads,
 * even when the details above it change under them.
 */
export function MoveVisitForm({ visit, engineers, reloadVisit, onMoved }: MoveVisitFormProps) {
  const headingId = useId();
  const [savedValues, setSavedValues] = useState(() => moveFormValuesOf(visit));
  const form = useForm<MoveVisitFormValues>({
    resolver: zodResolver(moveVisitFormSchema),
    defaultValues: savedValues,
  });
  const {
    register,
    formState: { errors, submitCount },
  } = form;
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [statusMessage, setStatusMessage] = useState('');
  const updateVisit = useUpdateVisit({
    mutationConfig: {
      onSuccess: (saved) => {
        const values = moveFormValuesOf(saved);
        setSavedValues(values);
        form.reset(values);
        setStatusMessage(`Saved: ${describeAssignment(saved)}.`);
        onMoved(saved);
      },
      onError: (error) =>
        setUnplacedMessages(placeVisitFieldErrors(error, form.setError, SHOWN_FIELDS)),
    },
  });

  const { isReloading, reloadLatest } = useReloadLatest(async () => {
    const latest = await reloadVisit();
    updateVisit.reset();
    setUnplacedMessages([]);
    if (latest) {
      const values = moveFormValuesOf(latest);
      setSavedValues(values);
      form.reset(values);
      setStatusMessage('The form now shows the visit as it is saved now.');
    } else {
      setStatusMessage('This visit is no longer in the schedule shown.');
    }
  });

  const submit = form.handleSubmit((values) => {
    setUnplacedMessages([]);
    setStatusMessage('');
    const data = toMoveInput(values, savedValues);
    if (!data) {
      setStatusMessage('Nothing has changed: choose another engineer, day or time first.');
      return;
    }
    updateVisit.mutate({ siteId: visit.siteId, visitId: visit.id, data });
  });

  // The engineer sent may have left the company's list; keep them as a choice.
  const choices =
    visit.engineer && !engineers.some((engineer) => engineer.id === visit.engineer!.id)
      ? [...engineers, { id: visit.engineer.id, displayName: visit.engineer.name }]
      : engineers;

  return (
    <section aria-labelledby={headingId} className="grid gap-3">
      <h3 id={headingId} className="font-semibold">
        Send an engineer or move the visit
      </h3>
      <form noValidate onSubmit={submit} aria-labelledby={headingId} className="grid gap-4">
        <VisitSaveProblem
          subject="The change to this visit"
          fieldErrorCount={submitCount > 0 ? countFieldErrors(errors) : 0}
          error={updateVisit.error}
          unplacedMessages={unplacedMessages}
          onReloadLatest={reloadLatest}
          isReloading={isReloading}
        />
        <FormField label="Engineer" error={errors.engineerId?.message}>
          {(fieldProps) => (
            <select {...fieldProps} {...register('engineerId')} className={selectClassName()}>
              <option value="">No engineer yet</option>
              {choices.map((engineer) => (
                <option key={engineer.id} value={engineer.id}>
                  {engineer.displayName}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <div className="grid gap-4 sm:grid-cols-2">
          <FormField
            label="Day"
            hint="Leave day and time empty to keep the visit on its due date, unbooked."
            error={errors.day?.message}
          >
            {(fieldProps) => (
              <input
                {...fieldProps}
                {...register('day')}
                type="date"
                className={inputClassName({ mono: true })}
              />
            )}
          </FormField>
          <FormField label="Time" hint="UK time." error={errors.time?.message}>
            {(fieldProps) => (
              <input
                {...fieldProps}
                {...register('time')}
                type="time"
                className={inputClassName({ mono: true })}
              />
            )}
          </FormField>
        </div>
        <div className="flex flex-wrap items-center gap-3">
          <SubmitButton
            label="Save the visit"
            isPending={updateVisit.isPending}
            variant="primary"
          />
          <p role="status" className="font-semibold">
            {statusMessage}
          </p>
        </div>
      </form>
    </section>
  );
}
