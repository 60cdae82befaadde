import { z } from 'zod';
import { required } from '../schema/fields';

export const createChangeRequestSchema = z
  .object({
    subject: required(120, 'Subject'),
    details: required(4000, 'Details'),
  })
  .strict();
export type CreateChangeRequestInput = z.input<typeof createChangeRequestSchema>;

export const updateChangeRequestSchema = z.object({ status: z.enum(['open', 'closed']) }).strict();

export const changeRequestSchema = z.object({
  id: z.string(),
  subject: z.string(),
  details: z.string(),
  status: z.enum(['open', 'closed']),
  requestedBy: z.string().nullable(),
  createdAt: z.string(),
});
export type ChangeRequest = z.infer<typeof changeRequestSchema>;

export const changeRequestListSchema = z.object({ changeRequests: z.array(changeRequestSchema) });
