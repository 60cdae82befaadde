import { zodResolver } from '@hookform/resolvers/zod';
import { VISIT_KIND_LABELS, VISIT_KINDS, type ServiceVisit } from '@server/service/schema';
import { useEffect, useState } from 'react';
import { FormProvider, useForm, useWatch } from 'react-hook-form';

import { SubmitButton } from '@/components/forms/submit-button';
import { Button } from '@/components/ui/button';
import { FieldErrorMessage, FormField } from '@/components/ui/form-field';
import { checkboxClassName, inputClassName, selectClassName } from '@/components/ui/form-styles';
import { formatCalendarDate } from '@/lib/dates';
import { countFieldErrors } from '@/lib/form-errors';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';
import { useBookVisit } from '@/features/service/api/book-visit';
import { useServicePlan } from '@/features/service/api/get-service-plan';
import type { EngineerChoice } from '@/features/service/components/move-visit-form';
import { SitePicker } from '@/features/service/components/site-picker';
import { VisitSaveProblem } from '@/features/service/components/visit-save-problem';
import type { SiteChoice } from '@/features/service/utils/site-choice';
import {
  bookVisitFormSchema,
  emptyBooking,
  placeVisitFieldErrors,
  toBookingInput,
  type BookVisitFormValues,
} from '@/features/service/utils/visit-form-values';
import { describeBooking } from '@/features/service/utils/visit-words';

const SHOWN_FIELDS = ['siteId', 'kind', 'reportedFault', 'dueDate', 'day', 'engineerId'] as const;

/** A key for this booking, so a resend after a dropped connection books it once. */
function newBookingKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  // Older browsers on plain http: a version 4 UUID from random bytes (RFC 9562, section 5.4).
  const hex = Array.from(crypto.getRandomValues(new Uint8Array(16)), (byte, index) => {
    const value = index === 6 ? (byte & 0x0f) | 0x40 : index === 8 ? (byte & 0x3f) | 0x80 : byte;
    return value.toString(16).padStart(2, '0');
  }).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

/** What the chosen site's plan says, under the due date: the default, and any visit booked. */
function PlanHint({ siteId }: { siteId: string }) {
  const { data: plan } = useServicePlan(siteId || undefined);
  if (!siteId || !plan) return null;
  return (
    <div className="grid gap-1 text-sm">
      <p>
        {plan.nextDueOn
          ? `This site's plan puts the next preventive visit on ${formatCalendarDate(plan.nextDueOn)}${plan.overdue ? ', which has passed' : ''}; left empty, the due date is that day.`
          : 'This site has no plan date yet; left empty, the due date is today.'}
      </p>
      {plan.bookedVisit ? (
        <p className="font-semibold">
          A preventive visit is already booked here (
          {plan.bookedVisit.scheduledFor
            ? describeBooking(plan.bookedVisit.scheduledFor)
            : `due ${formatCalendarDate(plan.bookedVisit.dueDate)}`}
          ): move that one rather than booking another.
        </p>
      ) : null}
    </div>
  );
}

type BookVisitFormProps = {
  headingId: string;
  engineers: readonly EngineerChoice[];
  presetSite?: SiteChoice;
  onBooked: (visit: ServiceVisit) => void;
  onCancel: () => void;
};

/** The office books a preventive visit or a call-out for one site. */
export function BookVisitForm({
  headingId,
  engineers,
  presetSite,
  onBooked,
  onCancel,
}: BookVisitFormProps) {
  const form = useForm<BookVisitFormValues>({
    resolver: zodResolver(bookVisitFormSchema),
    defaultValues: emptyBooking(presetSite?.id),
  });
  const {
    register,
    control,
    formState: { errors, submitCount, isDirty },
  } = form;
  // One key per booking: kept across retries of this form, made afresh after it is booked.
  const [clientKey, setClientKey] = useState(newBookingKey);
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const bookVisit = useBookVisit({
    mutationConfig: {
      onSuccess: (visit) => {
        setClientKey(newBookingKey());
        form.reset(emptyBooking());
        onBooked(visit);
      },
      onError: (error) =>
        setUnplacedMessages(placeVisitFieldErrors(error, form.setError, SHOWN_FIELDS)),
    },
  });
  // The only guard on the page: React Router keeps one blocker at a time.
  useUnsavedChangesGuard(isDirty && !bookVisit.isPending);

  // Opened again from another site (the overdue list) while open: that site is the one chosen.
  useEffect(() => {
    if (presetSite) form.setValue('siteId', presetSite.id);
  }, [presetSite, form]);

  const kind = useWatch({ control, name: 'kind' });
  const siteId = useWatch({ control, name: 'siteId' });

  const submit = form.handleSubmit((values) => {
    setUnplacedMessages([]);
    bookVisit.mutate({ siteId: values.siteId, data: toBookingInput(values, clientKey) });
  });

  return (
    <FormProvider {...form}>
      <form noValidate onSubmit={submit} aria-labelledby={headingId} className="grid gap-5">
        <VisitSaveProblem
          subject="The booking"
          fieldErrorCount={submitCount > 0 ? countFieldErrors(errors) : 0}
          error={bookVisit.error}
          unplacedMessages={unplacedMessages}
        />
        <SitePicker presetSite={presetSite} />
        <fieldset>
          <legend className="mb-1 text-sm font-medium">Kind of visit</legend>
          <div className="flex flex-wrap gap-x-6 gap-y-1">
            {VISIT_KINDS.map((value) => (
              <label key={value} className="flex min-h-10 items-center gap-2">
                <input
                  type="radio"
                  value={value}
                  {...register('kind')}
                  className={checkboxClassName}
                />
                {VISIT_KIND_LABELS[value]}
              </label>
            ))}
          </div>
          <FieldErrorMessage message={errors.kind?.message} />
        </fieldset>
        {kind === 'corrective' ? (
          <FormField
            label="Reported fault"
            hint="What the customer or the monitoring centre reported."
            error={errors.reportedFault?.message}
          >
            {(fieldProps) => (
              <textarea
                {...fieldProps}
                {...register('reportedFault')}
                rows={3}
                className={inputClassName()}
              />
            )}
          </FormField>
        ) : null}
        <div className="grid gap-4 sm:grid-cols-3">
          <FormField
            label="Due date"
            optional
            hint={
              kind === 'preventive'
                ? 'Left empty: the next due date on the site’s plan.'
                : 'Left empty: today.'
            }
            error={errors.dueDate?.message}
          >
            {(fieldProps) => (
              <input
                {...fieldProps}
                {...register('dueDate')}
                type="date"
                className={inputClassName({ mono: true })}
              />
            )}
          </FormField>
          <FormField
            label="Visit day"
            optional
            hint="The day the engineer goes."
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
          <FormField label="Time" optional hint="UK time." error={errors.time?.message}>
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
        {kind === 'preventive' ? <PlanHint siteId={siteId} /> : null}
        <FormField label="Engineer" optional error={errors.engineerId?.message}>
          {(fieldProps) => (
            <select
              {...fieldProps}
              {...register('engineerId')}
              className={selectClassName({ className: 'sm:max-w-sm' })}
            >
              <option value="">No engineer yet</option>
              {engineers.map((engineer) => (
                <option key={engineer.id} value={engineer.id}>
                  {engineer.displayName}
                </option>
              ))}
            </select>
          )}
        </FormField>
        <div className="flex flex-wrap items-center gap-3">
          <SubmitButton
            label="Book the visit"
            pendingLabel="Booking…"
            isPending={bookVisit.isPending}
          />
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
