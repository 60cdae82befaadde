import { z } from 'zod';

export const organisationParams = z.object({
  organisationId: z.uuid('must be an organisation id'),
});

export const auditQuery = z.object({
  limit: z.coerce.number().int().min(1).max(200).default(50),
  /** Keyset paging: entries older than this id. */
  before: z.coerce.number().int().positive().optional(),
});
