import { z } from 'zod';
import { idSchema, required } from '../schema/fields';

/**
 * Requests and replies of the handover API, shared with the browser. A handover goes: the
 * pre-issue check is clear (or each remaining problem is written down as a variation), the
 * engineer and the customer sign, then the pack is issued — frozen, numbered and sealed.
 */

/** signature_pad's PNG export. Big enough for a phone-width drawing, small enough to keep. */
export const MAX_SIGNATURE_BYTES = 200 * 1024;
const PNG_DATA_URL = /^data:image\/png;base64,[A-Za-z0-9+/]+={0,2}$/;

export const signatureImageSchema = z
  .string({ error: 'Draw a signature first.' })
  .max(
    Math.ceil((MAX_SIGNATURE_BYTES * 4) / 3) + 32,
    'The signature is too large; clear it and sign again.',
  )
  .regex(PNG_DATA_URL, 'The signature must be a PNG image drawn on the signing pad.');

export const engineerSignatureInputSchema = z.object({ image: signatureImageSchema }).strict();

export const customerSignatureInputSchema = z
  .object({
    name: required(120, 'The customer’s name'),
    image: signatureImageSchema,
  })
  .strict();
export type CustomerSignatureInput = z.input<typeof customerSignatureInputSchema>;

export const variationsInputSchema = z
  .object({
    variations: z
      .array(required(1000, 'The variation'), { error: 'Send a list of variations.' })
      .max(50, 'At most 50 variations.'),
    version: z.number().int().positive().nullable(),
  })
  .strict();
export type VariationsInput = z.input<typeof variationsInputSchema>;

export const signingRequestInputSchema = z.object({ homeownerUserId: idSchema }).strict();

export const PACK_PREFIX_PATTERN = /^[A-Z]{2,6}$/;
export const packSettingsInputSchema = z
  .object({
    prefix: z
      .string()
      .trim()
      .toUpperCase()
      .regex(PACK_PREFIX_PATTERN, 'Use 2 to 6 letters, A to Z, e.g. WB.'),
  })
  .strict();

/** e.g. "HW-000042-R1": office prefix, gap-free number, revision. */
export const PACK_NUMBER_PATTERN = /^[A-Z]{2,6}-\d{6}-R\d{1,3}$/;
export const packNumberSchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(PACK_NUMBER_PATTERN, 'A pack number looks like HW-000042-R1.');

// --- Replies -----------------------------------------------------------------------------------

export const BUILD_STAGES = [
  'queued',
  'collecting',
  'rendering',
  'sealing',
  'sending',
  'done',
] as const;
export const BUILD_STAGE_LABELS: Record<(typeof BUILD_STAGES)[number], string> = {
  queued: 'Waiting to start',
  collecting: 'Gathering the records',
  rendering: 'Drawing the PDF',
  sealing: 'Numbering and sealing',
  sending: 'E-mailing the homeowner',
  done: 'Issued',
};

export const packBuildSchema = z.object({
  id: z.string(),
  status: z.enum(['queued', 'running', 'done', 'failed']),
  stage: z.enum(BUILD_STAGES),
  /** 0–100, for the progress bar. */
  percent: z.number(),
  packNumber: z.string().nullable(),
  error: z.string().nullable(),
});
export type PackBuild = z.infer<typeof packBuildSchema>;

const signedSchema = z.object({ name: z.string(), signedAt: z.string() });

export const handoverDraftSchema = z.object({
  id: z.string(),
  variations: z.array(z.object({ text: z.string() })),
  engineerSignature: signedSchema.nullable(),
  customerSignature: signedSchema.extend({ via: z.enum(['in_person', 'request']) }).nullable(),
  signingRequest: z
    .object({ id: z.string(), sentTo: z.string(), sentAt: z.string(), signed: z.boolean() })
    .nullable(),
  build: packBuildSchema.nullable(),
  version: z.number(),
});
export type HandoverDraft = z.infer<typeof handoverDraftSchema>;

export const PACK_STATUSES = ['valid', 'superseded', 'revoked'] as const;
export const packSummarySchema = z.object({
  packNumber: z.string(),
  revision: z.number(),
  siteId: z.string(),
  siteName: z.string(),
  status: z.enum(PACK_STATUSES),
  supersededBy: z.string().nullable(),
  revokedReason: z.string().nullable(),
  issuedAt: z.string(),
  issuedBy: z.string(),
  sha256: z.string(),
  sizeBytes: z.number(),
  /** Signed-in download. */
  downloadUrl: z.string(),
  /** The public verification page. */
  verifyUrl: z.string(),
});
export type PackSummary = z.infer<typeof packSummarySchema>;

export const handoverStateSchema = z.object({
  draft: handoverDraftSchema,
  packs: z.array(packSummarySchema),
  /** People who can countersign: the site's homeowners. */
  homeowners: z.array(z.object({ id: z.string(), name: z.string(), email: z.string() })),
  /** The blocking problems that need a written variation before issue, if the check is not clear. */
  blocking: z.array(z.string()),
  canIssue: z.boolean(),
  /** Why not, in plain words, when canIssue is false. */
  waitingFor: z.array(z.string()),
});
export type HandoverState = z.infer<typeof handoverStateSchema>;

export const documentsSchema = z.object({ packs: z.array(packSummarySchema) });

export const signingRequestSchema = z.object({
  id: z.string(),
  siteName: z.string(),
  engineerName: z.string().nullable(),
  variations: z.array(z.object({ text: z.string() })),
  signed: z.boolean(),
  previewUrl: z.string(),
});
export type SigningRequest = z.infer<typeof signingRequestSchema>;

export const verificationSchema = z.object({
  packNumber: z.string(),
  revision: z.number(),
  status: z.enum(PACK_STATUSES),
  supersededBy: z.string().nullable(),
  revokedReason: z.string().nullable(),
  issuedAt: z.string(),
  issuedBy: z.string(),
  installer: z.string(),
  /** The site's reference and town only: the verification page is public. */
  site: z.object({ reference: z.string(), town: z.string() }),
  sha256: z.string(),
  sizeBytes: z.number(),
  seal: z.object({
    algorithm: z.literal('Ed25519'),
    keyId: z.string(),
    publicKey: z.string(),
    /** The exact text that was signed. */
    signedText: z.string(),
    signature: z.string(),
    valid: z.boolean(),
  }),
});
export type Verification = z.infer<typeof verificationSchema>;

export const pdfCheckSchema = z.object({
  packNumber: z.string(),
  matches: z.boolean(),
  uploadedSha256: z.string(),
  expectedSha256: z.string(),
  uploadedBytes: z.number(),
  message: z.string(),
});
export type PdfCheck = z.infer<typeof pdfCheckSchema>;

export const sealKeySchema = z.object({
  keyId: z.string(),
  organisation: z.string(),
  publicKey: z.string(),
  createdAt: z.string(),
  retiredAt: z.string().nullable(),
});
export const sealKeysSchema = z.object({ keys: z.array(sealKeySchema) });

export const packSettingsSchema = z.object({
  prefix: z.string(),
  nextNumber: z.number(),
  keys: z.array(sealKeySchema),
});
export type PackSettings = z.infer<typeof packSettingsSchema>;

export const revokeInputSchema = z.object({ reason: required(500, 'The reason') }).strict();
