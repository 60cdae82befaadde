import { z } from 'zod';
import { required } from '../schema/fields';

/**
 * Faults a homeowner reports on their own system, and the installer office's queue of them.
 * Shared with the browser's forms, so nothing here but zod.
 */
export const MAX_FAULT_PHOTOS = 4;
/** Photos only: a fault report is not the place for documents. */
export const FAULT_PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;

export const FAULT_STATUSES = ['open', 'scheduled', 'closed'] as const;
export type FaultStatus = (typeof FAULT_STATUSES)[number];

/** The homeowner's words for where their report has got to. */
export const FAULT_STATUS_WORDS: Record<FaultStatus, string> = {
  open: 'Reported: your installer will be in touch to arrange a visit',
  scheduled: 'A visit is booked',
  closed: 'Dealt with',
};

/** Sent as form fields beside the photos (multipart), or as JSON without photos. */
export const faultReportInputSchema = z
  .object({
    description: required(2000, 'What is wrong').min(5, 'Say a little more about what is wrong.'),
    /** Made on the phone for this report: sent twice, it is recorded once. */
    clientKey: z.uuid('Not a valid record key.').optional(),
  })
  .strict();
export type FaultReportInput = z.input<typeof faultReportInputSchema>;

export const faultQueueQuerySchema = z
  .object({
    /** "active" is open and booked: what the office still has to deal with. */
    status: z
      .enum([...FAULT_STATUSES, 'active', 'all'], {
        error: 'Choose open, scheduled, closed, active or all.',
      })
      .default('active'),
  })
  .strict();

// --- Responses ---------------------------------------------------------------------------------

export const faultPhotoSchema = z.object({
  id: z.string(),
  fileName: z.string(),
  contentType: z.string(),
  /** Streams the photo to anyone who may see the site (server/files). */
  url: z.string(),
});

export const faultReportSchema = z.object({
  id: z.string(),
  siteId: z.string(),
  description: z.string(),
  status: z.enum(FAULT_STATUSES),
  statusWords: z.string(),
  photos: z.array(faultPhotoSchema),
  reportedAt: z.string(),
  visit: z
    .object({
      id: z.string(),
      dueDate: z.string(),
      scheduledFor: z.string().nullable(),
      engineerName: z.string().nullable(),
    })
    .nullable(),
  closingNote: z.string(),
});
export type FaultReport = z.infer<typeof faultReportSchema>;

export const reportedFaultSchema = faultReportSchema.extend({
  /** Whether the acknowledgement e-mail went; the report is kept either way. */
  acknowledgementSent: z.boolean(),
});

export const queuedFaultSchema = faultReportSchema.extend({
  siteReference: z.string(),
  siteName: z.string(),
  siteTown: z.string(),
  reportedBy: z.object({ name: z.string(), email: z.string() }).nullable(),
});
export type QueuedFault = z.infer<typeof queuedFaultSchema>;

export const faultQueueSchema = z.object({ faults: z.array(queuedFaultSchema) });
