import { z } from 'zod';

/** What a site file may be: decided from the bytes, never from the name or the browser. */
export const ALLOWED_FILE_TYPES = [
  'image/jpeg',
  'image/png',
  'image/webp',
  'application/pdf',
] as const;
export const MAX_FILE_BYTES = 15 * 1024 * 1024;

export const siteFileSchema = z.object({
  id: z.string(),
  fileName: z.string(),
  contentType: z.enum(ALLOWED_FILE_TYPES),
  sizeBytes: z.number(),
  sha256: z.string(),
  description: z.string(),
  uploadedBy: z.string().nullable(),
  uploadedAt: z.string(),
});
export type SiteFile = z.infer<typeof siteFileSchema>;

export const siteFileListSchema = z.object({ files: z.array(siteFileSchema) });

export const uploadFieldsSchema = z
  .object({
    description: z
      .string()
      .trim()
      .max(200, 'Keep the description under 200 characters.')
      .default(''),
  })
  .strict();
