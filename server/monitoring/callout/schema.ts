import { z } from 'zod';
import { required, trimmed } from '../../schema/fields';
import { CALL_RESULTS } from './service';

export const startCallOutInputSchema = z.object({}).strict();

export const recordCallInputSchema = z
  .object({
    position: z.number().int().min(1).max(99).nullable().default(null),
    who: trimmed(120, 'Who was called').default(''),
    result: z.enum(CALL_RESULTS, { error: 'Choose how the call went.' }),
    note: trimmed(1000, 'Note').default(''),
  })
  .strict()
  .refine((input) => input.position !== null || input.who.length > 0, {
    path: ['who'],
    message: 'Say who was called, or choose them from the call plan.',
  });

export const requestPoliceInputSchema = z
  .object({
    incidentReference: required(60, 'The police incident or log number'),
    note: trimmed(1000, 'Note').default(''),
  })
  .strict();

/** What Twilio posts about a message's delivery (only the fields used). */
export const statusCallbackSchema = z.object({
  MessageSid: z.string().regex(/^(SM|MM)[0-9a-f]{32}$/i),
  MessageStatus: z.string().min(1).max(40),
  ErrorCode: z.string().max(20).optional(),
});
export const statusCallbackQuerySchema = z.object({ message: z.uuid() });

/** What Twilio posts when a keyholder texts the centre's number. */
export const inboundMessageSchema = z.object({
  From: z.string().regex(/^\+[1-9][0-9]{6,14}$/),
  Body: z.string().max(1600).default(''),
  MessageSid: z.string().max(64).optional(),
});
