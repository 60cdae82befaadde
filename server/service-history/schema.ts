import { z } from 'zod';
import { FAULT_STATUSES } from '../faults/schema';
import { VISIT_KINDS } from '../service/schema';

/** A homeowner's service history: one timeline of what has happened to their system. */
const visitEntrySchema = z.object({
  kind: z.literal('visit'),
  id: z.string(),
  at: z.string(),
  visitKind: z.enum(VISIT_KINDS),
  title: z.string(),
  /** The outcome in words, as recorded when the engineer completed the visit. */
  outcome: z.string(),
  passed: z.boolean().nullable(),
  findings: z.array(z.string()),
  engineerName: z.string().nullable(),
  /** The visit's service report, once it has been drawn. */
  reportUrl: z.string().nullable(),
});

const faultEntrySchema = z.object({
  kind: z.literal('fault_report'),
  id: z.string(),
  at: z.string(),
  title: z.string(),
  description: z.string(),
  status: z.enum(FAULT_STATUSES),
  statusWords: z.string(),
  photoCount: z.number(),
  visitId: z.string().nullable(),
});

const packEntrySchema = z.object({
  kind: z.literal('handover_pack'),
  id: z.string(),
  at: z.string(),
  title: z.string(),
  packNumber: z.string(),
  revision: z.number(),
  status: z.enum(['valid', 'superseded', 'revoked']),
  downloadUrl: z.string(),
});

export const serviceHistoryEntrySchema = z.discriminatedUnion('kind', [
  visitEntrySchema,
  faultEntrySchema,
  packEntrySchema,
]);
export type ServiceHistoryEntry = z.infer<typeof serviceHistoryEntrySchema>;

export const serviceHistorySchema = z.object({
  siteId: z.string(),
  /** Newest first. */
  entries: z.array(serviceHistoryEntrySchema),
});
export type ServiceHistory = z.infer<typeof serviceHistorySchema>;
