import { z } from 'zod';
import { readingSchema } from '../calculators/schema';
import { LOOP_STATES } from '../commissioning/schema';
import { signatureImageSchema } from '../handover/schema';
import { dateSchema, idSchema, required, trimmed, versionSchema } from '../schema/fields';

/**
 * Service and maintenance: the plan each site's signalling calls for, the visits the office
 * books against it, call-outs, and the forms engineers complete on site. Shared with the
 * browser's forms, so nothing here but zod.
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

// --- Completing a visit -------------------------------------------------------------------------

/** A phone's clock may run a little fast: a finish time this far ahead is taken as now. */
export const CLOCK_SKEW_MINUTES = 5;
/**
 * Handheld meters top out in the tens of megohms; a finite reading above this is a typing slip
 * for an open circuit (common practice, no source).
 */
export const MAX_LOOP_READING_OHMS = 100_000_000;
/** Alarm supplies run from 9 V to 30 V (the system record's own range). */
export const MAX_BATTERY_VOLTS = 30;

const completedAtSchema = z.iso.datetime({
  offset: true,
  error: 'Send the time the visit finished as an ISO 8601 date-time, e.g. 2027-03-10T11:45:00Z.',
});
const completionKeySchema = z.uuid('Missing the record key made on the device.');

const loopReadingSchema = readingSchema.refine(
  (ohms) => !Number.isFinite(ohms) || ohms <= MAX_LOOP_READING_OHMS,
  'Over 100 MΩ is beyond a meter’s range: enter OL for an open circuit.',
);

const batteryVoltsSchema = (what: string) =>
  z
    .number({ error: `Enter the ${what} in volts, e.g. 12.8.` })
    .min(0, 'Volts cannot be negative.')
    .max(MAX_BATTERY_VOLTS, `Over ${MAX_BATTERY_VOLTS} V? Check the meter’s range.`);

export const batteryReadingsSchema = z
  .object({
    restingVolts: batteryVoltsSchema('voltage at rest'),
    loadTestVolts: batteryVoltsSchema('voltage under load'),
    loadTestAmps: z
      .number({ error: 'Enter the load current in amps, e.g. 1.5.' })
      .positive('Enter the load current in amps, e.g. 1.5.')
      .max(20, 'Over 20 A? Enter the load current in amps.')
      .nullable()
      .default(null),
  })
  .strict();

export const zoneReadingInputSchema = z
  .object({
    zoneId: idSchema,
    secureReading: loopReadingSchema,
    alarmReading: loopReadingSchema.nullable().default(null),
    activated: z.boolean({ error: 'Say whether the panel showed the zone when you walked it.' }),
    note: trimmed(500, 'The note').default(''),
  })
  .strict();

export const CHECK_RESULTS = ['passed', 'failed'] as const;
export const SOUNDER_RESULTS = ['passed', 'failed', 'none_fitted'] as const;

const checkResultSchema = z
  .object({
    result: z.enum(CHECK_RESULTS, { error: 'Choose passed or failed.' }),
    note: trimmed(500, 'The note').default(''),
  })
  .strict();
const sounderResultSchema = z
  .object({
    result: z.enum(SOUNDER_RESULTS, { error: 'Choose passed, failed or none fitted.' }),
    note: trimmed(500, 'The note').default(''),
  })
  .strict();

export const pathTestInputSchema = z
  .object({
    pathId: idSchema,
    result: z.enum(CHECK_RESULTS, { error: 'Choose passed or failed.' }),
    centreReference: trimmed(40, 'The centre’s reference').default(''),
  })
  .strict();

/** Wardbook's own scale for how sure the customer is of using the system, 1 to 5. */
export const CONFIDENCE_WORDS = [
  'not confident',
  'unsure',
  'fairly confident',
  'confident',
  'very confident',
] as const;
export type ConfidenceWords = (typeof CONFIDENCE_WORDS)[number];

export const userConfidenceSchema = z
  .union([z.number().int().min(1).max(5), z.enum(CONFIDENCE_WORDS)], {
    error: `Rate the customer’s confidence from 1 to 5, or in words: ${CONFIDENCE_WORDS.join(', ')}.`,
  })
  .transform((value) =>
    typeof value === 'number'
      ? { score: value, words: CONFIDENCE_WORDS[value - 1]! }
      : { score: CONFIDENCE_WORDS.indexOf(value) + 1, words: value },
  );

/** Checklist items that can be left untested, with the customer's signature. */
export const NOT_TESTED_ITEMS = [
  'battery',
  'tampers',
  'internal_sounders',
  'external_sounders',
  'zone',
  'signalling_path',
] as const;
export type NotTestedItem = (typeof NOT_TESTED_ITEMS)[number];

const notTestedReason = required(500, 'The reason');
export const notTestedInputSchema = z.discriminatedUnion(
  'item',
  [
    z
      .object({
        item: z.enum(['battery', 'tampers', 'internal_sounders', 'external_sounders']),
        reason: notTestedReason,
      })
      .strict(),
    z.object({ item: z.literal('zone'), zoneId: idSchema, reason: notTestedReason }).strict(),
    z
      .object({ item: z.literal('signalling_path'), pathId: idSchema, reason: notTestedReason })
      .strict(),
  ],
  {
    error: `Name what was not tested: ${NOT_TESTED_ITEMS.join(', ')}.`,
  },
);
export type NotTestedInput = z.output<typeof notTestedInputSchema>;

const fixedItems = [
  { item: 'battery', label: 'The battery test' },
  { item: 'tampers', label: 'The tamper test' },
  { item: 'internal_sounders', label: 'The internal sounder test' },
  { item: 'external_sounders', label: 'The external sounder test' },
] as const;

export const preventiveCompletionSchema = z
  .object({
    kind: z.literal('preventive'),
    clientKey: completionKeySchema,
    completedAt: completedAtSchema,
    battery: batteryReadingsSchema.nullable().default(null),
    zones: z.array(zoneReadingInputSchema).max(512, 'At most 512 zones.').default([]),
    tampers: checkResultSchema.nullable().default(null),
    sounders: z
      .object({
        internal: sounderResultSchema.nullable().default(null),
        external: sounderResultSchema.nullable().default(null),
      })
      .strict()
      .default({ internal: null, external: null }),
    signalling: z.array(pathTestInputSchema).max(4, 'A system has at most four paths.').default([]),
    userTrainingGiven: z.boolean({
      error: 'Say whether you went through using the system with the customer.',
    }),
    userConfidence: userConfidenceSchema,
    notTested: z.array(notTestedInputSchema).max(600).default([]),
    customerName: required(120, 'The customer’s name').optional(),
    customerSignature: signatureImageSchema.optional(),
    note: trimmed(2000, 'The note').default(''),
  })
  .strict()
  .superRefine((input, context) => {
    const issue = (path: (string | number)[], message: string) =>
      context.addIssue({ code: 'custom', path, message });
    const listed = new Map<string, number>();
    input.notTested.forEach((entry, index) => {
      const key =
        entry.item === 'zone'
          ? `zone:${entry.zoneId}`
          : entry.item === 'signalling_path'
            ? `path:${entry.pathId}`
            : entry.item;
      if (listed.has(key)) issue(['notTested', index], 'This item is already on the list.');
      else listed.set(key, index);
    });
    const recorded = {
      battery: input.battery !== null,
      tampers: input.tampers !== null,
      internal_sounders: input.sounders.internal !== null,
      external_sounders: input.sounders.external !== null,
    };
    const fieldOf = {
      battery: ['battery'],
      tampers: ['tampers'],
      internal_sounders: ['sounders', 'internal'],
      external_sounders: ['sounders', 'external'],
    };
    for (const { item, label } of fixedItems) {
      const index = listed.get(item);
      if (!recorded[item] && index === undefined)
        issue(fieldOf[item], `${label} is missing: record it, or list it as not tested with why.`);
      if (recorded[item] && index !== undefined)
        issue(['notTested', index], `${label} is recorded: take it off the not-tested list.`);
    }
    const zoneSeen = new Set<string>();
    input.zones.forEach((zone, index) => {
      if (zoneSeen.has(zone.zoneId))
        issue(['zones', index, 'zoneId'], 'This zone already has a reading above.');
      zoneSeen.add(zone.zoneId);
      const notTestedIndex = listed.get(`zone:${zone.zoneId}`);
      if (notTestedIndex !== undefined)
        issue(['notTested', notTestedIndex], 'This zone has a reading: take it off the list.');
    });
    const pathSeen = new Set<string>();
    input.signalling.forEach((path, index) => {
      if (pathSeen.has(path.pathId))
        issue(['signalling', index, 'pathId'], 'This path is already tested above.');
      pathSeen.add(path.pathId);
      const notTestedIndex = listed.get(`path:${path.pathId}`);
      if (notTestedIndex !== undefined)
        issue(['notTested', notTestedIndex], 'This path was tested: take it off the list.');
    });
    if (input.notTested.length > 0) {
      if (!input.customerName)
        issue(['customerName'], 'The customer signs for what was not tested: enter their name.');
      if (!input.customerSignature)
        issue(
          ['customerSignature'],
          'The customer signs for what was not tested: ask them to sign on the pad.',
        );
    }
  });
export type PreventiveCompletionInput = z.input<typeof preventiveCompletionSchema>;

/**
 * What caused the fault a call-out dealt with. The list is Wardbook's, written from memory of
 * installers' practice (no published list).
 */
export const PRIME_CAUSES = [
  'equipment_fault',
  'environment',
  'user_error',
  'installation',
  'signalling',
  'unknown',
] as const;
export type PrimeCause = (typeof PRIME_CAUSES)[number];
export const PRIME_CAUSE_LABELS: Record<PrimeCause, string> = {
  equipment_fault: 'Equipment fault',
  environment: 'Environment',
  user_error: 'User error',
  installation: 'Installation',
  signalling: 'Signalling',
  unknown: 'Unknown',
};
export const PRIME_CAUSE_SOURCE = 'from memory of installers’ practice; no published list';

export const partReplacedSchema = z
  .object({
    part: required(120, 'The part'),
    quantity: z
      .number({ error: 'Enter how many were fitted.' })
      .int('Whole parts only.')
      .min(1, 'At least 1.')
      .max(100, 'At most 100 of one part.'),
  })
  .strict();

export const correctiveCompletionSchema = z
  .object({
    kind: z.literal('corrective'),
    clientKey: completionKeySchema,
    completedAt: completedAtSchema,
    /** What was wrong as found on site; defaults to the fault as reported when booked. */
    reportedFault: required(2000, 'The reported fault').optional(),
    primeCause: z.enum(PRIME_CAUSES, {
      error: `Choose the prime cause: ${PRIME_CAUSES.map((cause) => PRIME_CAUSE_LABELS[cause].toLowerCase()).join(', ')}.`,
    }),
    actionTaken: required(2000, 'What you did'),
    partsReplaced: z.array(partReplacedSchema).max(50, 'At most 50 parts.').default([]),
    falseAlarm: z.boolean({ error: 'Say whether the call-out followed a false alarm.' }),
    falseAlarmCause: trimmed(1000, 'The false alarm’s cause').optional(),
    note: trimmed(2000, 'The note').default(''),
  })
  .strict()
  .superRefine((input, context) => {
    if (input.falseAlarm && !input.falseAlarmCause)
      context.addIssue({
        code: 'custom',
        path: ['falseAlarmCause'],
        message: 'Say what caused the false alarm: it goes on the site’s false-alarm record.',
      });
    if (!input.falseAlarm && input.falseAlarmCause)
      context.addIssue({
        code: 'custom',
        path: ['falseAlarmCause'],
        message: 'Only a false alarm has a cause here: mark it a false alarm, or clear the cause.',
      });
  });
export type CorrectiveCompletionInput = z.input<typeof correctiveCompletionSchema>;

export const completeVisitInputSchema = z.discriminatedUnion(
  'kind',
  [preventiveCompletionSchema, correctiveCompletionSchema],
  { error: 'Say which form this is: preventive or corrective.' },
);
export type CompleteVisitInput = z.input<typeof completeVisitInputSchema>;

// --- Booking a call-out -------------------------------------------------------------------------

export const bookCalloutInputSchema = z
  .object({
    /** Booked from a homeowner's fault report; without one, from a phone call. */
    faultReportId: idSchema.optional(),
    /** Defaults to the fault report's description. */
    reportedFault: required(2000, 'The reported fault').optional(),
    /** Defaults to today. */
    dueDate: dateSchema.optional(),
    scheduledFor: scheduledForSchema.nullable().default(null),
    engineerId: engineerIdSchema.default(null),
    clientKey: z.uuid('Not a valid record key.').optional(),
  })
  .strict()
  .refine((input) => input.faultReportId || input.reportedFault, {
    path: ['reportedFault'],
    message: 'Say what fault was reported, or book from a fault report.',
  });
export type BookCalloutInput = z.input<typeof bookCalloutInputSchema>;

// --- Completed visits (responses) ---------------------------------------------------------------

const loopStateSchema = z.enum(LOOP_STATES);

export const zoneResultSchema = z.object({
  zoneId: z.string(),
  number: z.number(),
  location: z.string(),
  /** Null for an open circuit (OL) or a reading that could not be classified. */
  secureReadingOhms: z.number().nullable(),
  secureOpen: z.boolean(),
  secureState: loopStateSchema.nullable(),
  alarmReadingOhms: z.number().nullable(),
  alarmOpen: z.boolean(),
  alarmState: loopStateSchema.nullable(),
  activated: z.boolean(),
  passed: z.boolean(),
  failures: z.array(z.string()),
  note: z.string(),
});
export type ZoneResult = z.infer<typeof zoneResultSchema>;

export const visitOutcomeSchema = z.object({
  /** Null for a call-out: it has findings and actions, not a pass or fail. */
  passed: z.boolean().nullable(),
  words: z.string(),
  findings: z.array(z.string()),
});
export type VisitOutcome = z.infer<typeof visitOutcomeSchema>;

/** The preventive checklist as stored in service_visits.checklist. */
export const preventiveChecklistSchema = z.object({
  battery: batteryReadingsSchema
    .extend({
      passed: z.boolean(),
      reasons: z.array(z.string()),
      notes: z.array(z.string()),
    })
    .nullable(),
  zones: z.array(zoneResultSchema),
  tampers: checkResultSchema.nullable(),
  sounders: z.object({
    internal: sounderResultSchema.nullable(),
    external: sounderResultSchema.nullable(),
  }),
  signalling: z.array(
    z.object({
      pathId: z.string(),
      position: z.number(),
      bearer: z.string(),
      description: z.string(),
      result: z.enum(CHECK_RESULTS),
      centreReference: z.string(),
    }),
  ),
  userTrainingGiven: z.boolean(),
  userConfidence: z.object({ score: z.number(), words: z.string() }),
  notTested: z.array(
    z.object({
      item: z.enum(NOT_TESTED_ITEMS),
      zoneId: z.string().nullable(),
      pathId: z.string().nullable(),
      label: z.string(),
      reason: z.string(),
    }),
  ),
  note: z.string(),
  outcome: visitOutcomeSchema,
});
export type PreventiveChecklist = z.infer<typeof preventiveChecklistSchema>;

export const completedVisitSchema = serviceVisitSchema.extend({
  outcome: visitOutcomeSchema,
  preventive: preventiveChecklistSchema.nullable(),
  corrective: z
    .object({
      reportedFault: z.string().nullable(),
      primeCause: z.enum(PRIME_CAUSES),
      primeCauseLabel: z.string(),
      actionTaken: z.string(),
      partsReplaced: z.array(z.object({ part: z.string(), quantity: z.number() })),
      falseAlarm: z.boolean(),
      falseAlarmCause: z.string().nullable(),
      note: z.string(),
    })
    .nullable(),
  customerSignedBy: z.string().nullable(),
  /** Preventive visits: the next one, now counted from this visit. */
  nextDueOn: z.string().nullable(),
});
export type CompletedVisit = z.infer<typeof completedVisitSchema>;

export const calloutSchema = serviceVisitSchema.extend({ faultReportId: z.string().nullable() });
