import { z } from 'zod';

/**
 * What an IP communicator posts to the HTTPS intake: the same payload a DC-09 frame carries,
 * as JSON. `data` is Contact ID (`1130 01 003`, optionally `#1000|` before it) for ADM-CID, or
 * a SIA-DCS event (`Nri1/BA03`, optionally `#1000|` before it).
 */
export const intakeSignalSchema = z
  .object({
    account: z
      .string({ error: 'Give the monitoring account.' })
      .trim()
      .toUpperCase()
      .regex(/^[0-9A-F]{3,16}$/, { error: 'The account is 3 to 16 characters, each 0–9 or A–F.' }),
    /** The panel's message number, 0 to 9999; a resend keeps it, which is how one is known. */
    sequence: z
      .union([
        z.int().min(0).max(9999),
        z.string().regex(/^\d{1,4}$/, { error: 'The sequence is a number from 0 to 9999.' }),
      ])
      .transform((value) => String(value).padStart(4, '0')),
    format: z.enum(['ADM-CID', 'SIA-DCS'], { error: 'The format is ADM-CID or SIA-DCS.' }),
    data: z
      .string({ error: 'Give the event data.' })
      .trim()
      .min(1, { error: 'Give the event data.' })
      .max(200, { error: 'The event data is at most 200 characters.' })
      .regex(/^[\x20-\x7E]+$/, { error: 'The event data is plain printable text.' }),
    /** The panel's clock, ISO 8601 with a zone, if it has one. */
    timestamp: z.iso
      .datetime({ offset: true, error: 'The timestamp is ISO 8601 with a time zone.' })
      .optional(),
  })
  .strict();
export type IntakeSignal = z.output<typeof intakeSignalSchema>;

export const intakeReceiptSchema = z.object({
  signalId: z.string(),
  /** True when this was a resend of a signal already stored: it was not stored again. */
  duplicate: z.boolean(),
});
export type IntakeReceipt = z.infer<typeof intakeReceiptSchema>;
