import { z } from 'zod';

export const alertParamsSchema = z.object({ eventId: z.uuid() });

export const alertResponseInputSchema = z
  .object({
    response: z.enum(['attending', 'cannot_attend'], {
      error: 'Say whether you are on your way or cannot attend.',
    }),
  })
  .strict();

export interface KeyholderAlert {
  eventId: string;
  siteName: string;
  town: string;
  address: string[];
  category: string;
  confirmed: boolean;
  raisedAt: string;
  callOutStatus: string;
  myResponse: 'attending' | 'cannot_attend' | null;
  respondedAt: string | null;
  closedAt: string | null;
  outcome: string | null;
}
