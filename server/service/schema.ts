import { z } from 'zod';
import { dateSchema, idSchema, trimmed, versionSchema } from '../schema/fields';

/**
 * Service and maintenance: the plan each site's signalling calls for, and the visits the office
 * books against it. Shared with the browser's forms, so nothing here but zod.
 */
export const VISIT_KINDS = ['preventive', 'corrective'] as const;
export type VisitKind = (typeof VISIT_KINDS)[number];
export const VISIT_STATUSES = ['scheduled', 'done', 'cancelled'] as const;
export type VisitStatus = (typeof VISIT_STATUSES)[number];

export const VISIT_KIND_LABELS: Record<VisitKind, string> = {
  preventive: 'Preventive visit',
  corrective: 'Call-out',
};

/** Longest stretch one schedule request may cover: a quarter, enough for a calendar view. */
export const MAX_SCHEDULE_DAYS = 92;
/** Visits are booked at most this far ahead; a later date is nearly always a mistyped year. */
export const MAX_BOOKING_YEARS_AHEAD = 2;

const scheduledForSchema = z.iso.datetime({
  offset: true,
  error: 'Send the time as an ISO 8601 date-time, e.g. 2027-03-10T09:30:00Z.',
});
const engineerIdSchema = idSchema.nullable();
const reportedFaultSchema = trimmed(2000, 'The reported fault');

export const scheduleVisitInputSchema = z
  .object({
    kind: z.enum(VISIT_KINDS, { error: 'Choose a preventive visit or a call-out.' }),
    /** Defaults to the plan's next due date (preventive) or today (call-out). */
    dueDate: dateSchema.optional(),
    scheduledFor: scheduledForSchema.nullable().default(null),
    engineerId: engineerIdSchema.default(null),
    reportedFault: reportedFaultSchema.optional(),
    /** Made by the browser for this booking: sent twice, it books once. */
    clientKey: z.uuid('Not a valid record key.').optional(),
  })
  .strict()
  .superRefine((input, context) => {
    if (input.kind === 'corrective' && !input.reportedFault)
      context.addIssue({
        code: 'custom',
        path: ['reportedFault'],
        message: 'Say what fault was reported.',
      });
    if (input.kind === 'preventive' && input.reportedFault)
      context.addIssue({
        code: 'custom',
        path: ['reportedFault'],
        message: 'A reported fault belongs on a call-out, not a preventive visit.',
      });
  });
export type ScheduleVisitInput = z.input<typeof scheduleVisitInputSchema>;

export const updateVisitInputSchema = z
  .object({
    version: versionSchema,
    dueDate: dateSchema.optional(),
    scheduledFor: scheduledForSchema.nullable().optional(),
    engineerId: engineerIdSchema.optional(),
    status: z
      .enum(['scheduled', 'cancelled'], {
        error: 'A visit can be cancelled or booked again here; it is marked done when completed.',
      })
      .optional(),
  })
  .strict()
  .refine(
    (input) =>
      input.dueDate !== undefined ||
      input.scheduledFor !== undefined ||
      input.engineerId !== undefined ||
      input.status !== undefined,
    { message: 'Nothing to change: send a date, an engineer or a status.' },
  );
export type UpdateVisitInput = z.input<typeof updateVisitInputSchema>;

export const scheduleQuerySchema = z
  .object({
    from: dateSchema.optional(),
    to: dateSchema.optional(),
    engineerId: idSchema.optional(),
  })
  .strict()
  .refine((query) => !query.from || !query.to || query.to >= query.from, {
    path: ['to'],
    message: 'The end date is before the start.',
  });

export const visitParamsSchema = z.object({ visitId: z.uuid('Not a valid visit id.') });

// --- Responses --------------------------------------------------------------------------------

export const bookedVisitSchema = z.object({
  id: z.string(),
  dueDate: z.string(),
  scheduledFor: z.string().nullable(),
  engineerName: z.string().nullable(),
});

export const servicePlanSchema = z.object({
  siteId: z.string(),
  signalling: z.enum(['remotely_monitored', 'audible_only']),
  signallingReason: z.string(),
  visitsPerYear: z.number(),
  intervalMonths: z.number(),
  rule: z.string(),
  source: z.string(),
  countsFrom: z.enum(['last_preventive_visit', 'in_service']).nullable(),
  countsFromOn: z.string().nullable(),
  inServiceSince: z.string().nullable(),
  inServiceBasis: z.enum(['handover', 'commissioning']).nullable(),
  lastPreventiveVisitOn: z.string().nullable(),
  nextDueOn: z.string().nullable(),
  overdue: z.boolean(),
  daysOverdue: z.number(),
  planChange: z.object({ fromVisitsPerYear: z.number(), toVisitsPerYear: z.number() }).nullable(),
  bookedVisit: bookedVisitSchema.nullable(),
  today: z.string(),
});
export type ServicePlanView = z.infer<typeof servicePlanSchema>;

export const serviceVisitSchema = z.object({
  id: z.string(),
  siteId: z.string(),
  siteReference: z.string(),
  siteName: z.string(),
  siteTown: z.string(),
  kind: z.enum(VISIT_KINDS),
  status: z.enum(VISIT_STATUSES),
  dueDate: z.string(),
  scheduledFor: z.string().nullable(),
  engineer: z.object({ id: z.string(), name: z.string() }).nullable(),
  planVisitsPerYear: z.number().nullable(),
  reportedFault: z.string().nullable(),
  completedAt: z.string().nullable(),
  version: z.number(),
});
export type ServiceVisit = z.infer<typeof serviceVisitSchema>;

export const scheduleSchema = z.object({
  from: z.string(),
  to: z.string(),
  visits: z.array(serviceVisitSchema),
});

export const overdueSiteSchema = z.object({
  siteId: z.string(),
  siteReference: z.string(),
  siteName: z.string(),
  siteTown: z.string(),
  visitsPerYear: z.number(),
  lastPreventiveVisitOn: z.string().nullable(),
  nextDueOn: z.string(),
  daysOverdue: z.number(),
  bookedVisit: bookedVisitSchema.nullable(),
});
export const overdueListSchema = z.object({
  today: z.string(),
  rule: z.string(),
  source: z.string(),
  sites: z.array(overdueSiteSchema),
});
