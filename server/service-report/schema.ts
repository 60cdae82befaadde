import { z } from 'zod';
import { completedVisitSchema } from '../service/schema';

/**
 * Everything a service report is drawn from, frozen when the job runs: the renderer reads
 * nothing else, so the same snapshot always draws the same report.
 */
export const serviceReportSnapshotSchema = z.object({
  reportId: z.string(),
  visit: completedVisitSchema,
  installer: z.object({ name: z.string() }),
  site: z.object({
    name: z.string(),
    reference: z.string(),
    addressLines: z.array(z.string()),
    hazards: z.string(),
  }),
  /** The customer's drawn signature for anything left untested (PNG data URL). */
  customerSignature: z.string().nullable(),
  /** When the report was drawn: its "issued" date. */
  preparedAt: z.string(),
});
export type ServiceReportSnapshot = z.infer<typeof serviceReportSnapshotSchema>;

export const SERVICE_REPORT_STATUSES = ['queued', 'done', 'failed'] as const;
export type ServiceReportStatus = (typeof SERVICE_REPORT_STATUSES)[number];
