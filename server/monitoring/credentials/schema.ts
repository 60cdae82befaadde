import { z } from 'zod';

/**
 * How a site's panel proves itself to the receiver: the AES key of its encrypted DC-09 frames,
 * and the bearer token an IP communicator presents to the HTTPS intake. Both are secrets: the
 * key is written by operators and never read back; the token is shown once, when issued.
 */

/** AES-128, -192 or -256 (SIA DC-09): 16, 24 or 32 bytes, written as 32, 48 or 64 hex digits. */
export const DC09_KEY_PATTERN = /^(?:[0-9A-F]{32}|[0-9A-F]{48}|[0-9A-F]{64})$/;

export const dc09KeySchema = z
  .string({ error: 'Enter the key as hex digits, or clear it.' })
  .trim()
  .toUpperCase()
  .regex(DC09_KEY_PATTERN, {
    error: 'The key is 32, 48 or 64 hex digits (0–9, A–F): AES-128, AES-192 or AES-256.',
  });

export const signallingCredentialsInputSchema = z
  .object({
    /** The new key, or null to stop expecting encrypted frames. */
    dc09Key: dc09KeySchema.nullable(),
  })
  .strict();
export type SignallingCredentialsInput = z.infer<typeof signallingCredentialsInputSchema>;

export const ENCRYPTION_NAMES = { 32: 'AES-128', 48: 'AES-192', 64: 'AES-256' } as const;

/** What the screens may know: whether a key is set and its strength, never the key. */
export const signallingCredentialsSchema = z.object({
  siteId: z.string(),
  account: z.string(),
  encryption: z.enum(['AES-128', 'AES-192', 'AES-256']).nullable(),
  intakeTokenIssuedAt: z.string().nullable(),
});
export type SignallingCredentials = z.infer<typeof signallingCredentialsSchema>;

/** The token in clear, this once; only its SHA-256 is stored. */
export const issuedIntakeTokenSchema = z.object({
  siteId: z.string(),
  account: z.string(),
  token: z.string(),
  issuedAt: z.string(),
});
export type IssuedIntakeToken = z.infer<typeof issuedIntakeTokenSchema>;
