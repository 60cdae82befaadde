import { z } from 'zod';

import {
  alarmEventDetailSchema,
  alarmEventUrl,
  type AlarmEventDetail,
} from '@/features/monitoring/api/get-alarm-event';
import { useAlarmEventAction } from '@/features/monitoring/api/alarm-event-actions';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export const requestPoliceInputSchema = z.object({
  incidentReference: z
    .string()
    .trim()
    .min(1, 'Enter the reference the police gave for this request.')
    .max(60, 'Keep the reference to 60 characters.'),
  note: z.string().trim().max(1000, 'Keep the note to 1,000 characters.'),
});
export type RequestPoliceInput = z.infer<typeof requestPoliceInputSchema>;
export type RequestPoliceVariables = { eventId: string; input: RequestPoliceInput };

/**
 * Records that the police were asked to respond, quoting the site's URN. The API refuses (409,
 * with the reason) when the site has no active URN or the intruder alarm is not confirmed.
 */
export function requestPolice({ eventId, input }: RequestPoliceVariables) {
  return api.post(`${alarmEventUrl(eventId)}/police`, input, alarmEventDetailSchema);
}

export function useRequestPolice({
  mutationConfig,
}: { mutationConfig?: MutationConfig<AlarmEventDetail, RequestPoliceVariables> } = {}) {
  return useAlarmEventAction(requestPolice, mutationConfig);
}
