import { z } from 'zod';

import {
  alarmEventDetailSchema,
  alarmEventUrl,
  type AlarmEventDetail,
} from '@/features/monitoring/api/get-alarm-event';
import { useAlarmEventAction } from '@/features/monitoring/api/alarm-event-actions';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export const CALL_RESULTS = [
  'attending',
  'cannot_attend',
  'no_answer',
  'left_message',
  'other',
] as const;
export type CallResult = (typeof CALL_RESULTS)[number];

export const CALL_RESULT_LABELS: Record<CallResult, string> = {
  attending: 'Attending',
  cannot_attend: 'Cannot attend',
  no_answer: 'No answer',
  left_message: 'Left a message',
  other: 'Other (say in the note)',
};

// The same limits as the API's (server/monitoring/callout/schema.ts), checked here first so a
// mistake shows beside its field before anything is sent.
export const recordCallInputSchema = z.object({
  position: z.number().int().positive().nullable(),
  who: z
    .string()
    .trim()
    .min(1, 'Say who you called.')
    .max(200, 'Keep the name under 200 characters.'),
  result: z.enum(CALL_RESULTS, { error: 'Choose what came of the call.' }),
  note: z.string().trim().max(1000, 'Keep the note to 1,000 characters.'),
});
export type RecordCallInput = z.infer<typeof recordCallInputSchema>;
export type RecordCallVariables = { eventId: string; input: RecordCallInput };

/** Records a phone call the operator made about the event, to a keyholder or anyone else. */
export function recordCall({ eventId, input }: RecordCallVariables) {
  return api.post(`${alarmEventUrl(eventId)}/calls`, input, alarmEventDetailSchema);
}

export function useRecordCall({
  mutationConfig,
}: { mutationConfig?: MutationConfig<AlarmEventDetail, RecordCallVariables> } = {}) {
  return useAlarmEventAction(recordCall, mutationConfig);
}
