import {
  VISIT_KINDS,
  type ScheduleVisitInput,
  type ServiceVisit,
  type UpdateVisitInput,
} from '@server/service/schema';
import { dateSchema } from '@server/schema/fields';
import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';
import { z } from 'zod';

import { ApiError } from '@/lib/api-client';
import { ukDayOf, ukTimeOf, ukWallTimeToInstant } from '@/features/service/utils/uk-calendar';

/**
 * The office types a day and a time (UK clock) where the API wants one instant; the two are
 * checked together so that neither is dropped without a word.
 */
function checkDayAndTime(values: { day: string; time: string }, context: z.RefinementCtx): void {
  if (values.day && !dateSchema.safeParse(values.day).success)
    context.addIssue({ code: 'custom', path: ['day'], message: 'Enter the day as a date.' });
  if (values.day && !values.time)
    context.addIssue({
      code: 'custom',
      path: ['time'],
      message: 'Give the time the engineer is expected, e.g. 09:30.',
    });
  if (values.time && !values.day)
    context.addIssue({
      code: 'custom',
      path: ['day'],
      message: 'Give the day of the visit as well as the time.',
    });
}

const optionalDate = z
  .string()
  .refine((value) => value === '' || dateSchema.safeParse(value).success, 'Enter a date.');

export const bookVisitFormSchema = z
  .object({
    siteId: z.string().min(1, 'Choose the site to visit.'),
    kind: z.enum(VISIT_KINDS, { error: 'Choose a preventive visit or a call-out.' }),
    reportedFault: z.string().max(2000, 'The reported fault can be at most 2000 characters.'),
    dueDate: optionalDate,
    day: z.string(),
    time: z.string(),
    engineerId: z.string(),
  })
  .superRefine((values, context) => {
    checkDayAndTime(values, context);
    if (values.kind === 'corrective' && !values.reportedFault.trim())
      context.addIssue({
        code: 'custom',
        path: ['reportedFault'],
        message: 'Say what fault was reported.',
      });
  });
export type BookVisitFormValues = z.infer<typeof bookVisitFormSchema>;

export const emptyBooking = (siteId = ''): BookVisitFormValues => ({
  siteId,
  kind: 'preventive',
  reportedFault: '',
  dueDate: '',
  day: '',
  time: '',
  engineerId: '',
});

/** The request body; `clientKey` is made once per booking so a resend books it once. */
export function toBookingInput(values: BookVisitFormValues, clientKey: string): ScheduleVisitInput {
  return {
    kind: values.kind,
    ...(values.dueDate ? { dueDate: values.dueDate } : {}),
    scheduledFor: values.day && values.time ? ukWallTimeToInstant(values.day, values.time) : null,
    engineerId: values.engineerId || null,
    ...(values.kind === 'corrective' ? { reportedFault: values.reportedFault.trim() } : {}),
    clientKey,
  };
}

export const moveVisitFormSchema = z
  .object({
    engineerId: z.string(),
    day: z.string(),
    time: z.string(),
    version: z.number(),
  })
  .superRefine(checkDayAndTime);
export type MoveVisitFormValues = z.infer<typeof moveVisitFormSchema>;

export function moveFormValuesOf(visit: ServiceVisit): MoveVisitFormValues {
  return {
    engineerId: visit.engineer?.id ?? '',
    day: visit.scheduledFor ? ukDayOf(visit.scheduledFor) : '',
    time: visit.scheduledFor ? ukTimeOf(visit.scheduledFor) : '',
    version: visit.version,
  };
}

/**
 * Only what the person changed is sent: an unchanged booking in the past is not a new booking
 * in the past, and the API checks only the dates it is given.
 */
export function toMoveInput(
  values: MoveVisitFormValues,
  saved: MoveVisitFormValues,
): UpdateVisitInput | null {
  const dayOrTimeChanged = values.day !== saved.day || values.time !== saved.time;
  const engineerChanged = values.engineerId !== saved.engineerId;
  if (!dayOrTimeChanged && !engineerChanged) return null;
  return {
    version: values.version,
    ...(dayOrTimeChanged && {
      scheduledFor: values.day ? ukWallTimeToInstant(values.day, values.time) : null,
    }),
    ...(engineerChanged && { engineerId: values.engineerId || null }),
  };
}

/** Where the API's field errors (`body.scheduledFor`) show on these forms (the day field). */
const formFieldOfApiPath: Record<string, string> = {
  'body.kind': 'kind',
  'body.dueDate': 'dueDate',
  'body.scheduledFor': 'day',
  'body.engineerId': 'engineerId',
  'body.reportedFault': 'reportedFault',
};

/**
 * Puts the API's field errors beside the fields this form shows, and returns the messages that
 * belong to none of them, for the summary.
 */
export function placeVisitFieldErrors<Values extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<Values>,
  shownFields: readonly string[],
): string[] {
  if (!(error instanceof ApiError)) return [];
  const unplaced: string[] = [];
  for (const { path, message } of error.fieldErrors) {
    const field = formFieldOfApiPath[path];
    if (field && shownFields.includes(field))
      setError(field as Path<Values>, { type: 'server', message });
    else unplaced.push(message);
  }
  return unplaced;
}
