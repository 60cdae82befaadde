import { z } from 'zod';
import { urnStatusSchema } from '../sites/schema';

/** A number to ring, with the organisation it belongs to. */
const contactSchema = z.object({
  name: z.string(),
  phone: z.string().nullable(),
  outOfHoursPhone: z.string().nullable(),
  email: z.string().nullable(),
});
export type Contact = z.infer<typeof contactSchema>;

const addressSchema = z.object({
  addressLine1: z.string(),
  addressLine2: z.string(),
  town: z.string(),
  postcode: z.string(),
});

/** What a homeowner sees of their own site. */
export const myHomeSchema = z.object({
  id: z.string(),
  reference: z.string(),
  name: z.string(),
  address: addressSchema,
  accessNotes: z.string(),
  hazards: z.string(),
  requiredGrade: z.number(),
  environmentalClass: z.number(),
  policeUrn: z.string().nullable(),
  urnStatus: urnStatusSchema,
  monitoringAccount: z.string().nullable(),
  installer: contactSchema,
  monitoringCentre: contactSchema.nullable(),
  counts: z.object({
    zones: z.number(),
    keyholders: z.number(),
    userSlots: z.number(),
    files: z.number(),
  }),
});
export type MyHome = z.infer<typeof myHomeSchema>;

export const myHomeListSchema = z.object({ homes: z.array(myHomeSchema) });

/** Everything a keyholder sees of a site they hold keys for — and nothing more. */
export const keyholdingSchema = z.object({
  siteId: z.string(),
  keyholderId: z.string(),
  siteName: z.string(),
  address: addressSchema,
  accessNotes: z.string(),
  hazards: z.string(),
  callOrder: z.number(),
  keyholderCount: z.number(),
  minutesToAttend: z.number(),
  monitoringCentre: contactSchema.nullable(),
});
export type Keyholding = z.infer<typeof keyholdingSchema>;

export const keyholdingListSchema = z.object({ keyholdings: z.array(keyholdingSchema) });
