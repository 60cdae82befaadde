import { closeEventInputSchema } from '@server/monitoring/schema';
import type { z } from 'zod';

import {
  alarmEventDetailSchema,
  alarmEventUrl,
  type AlarmEventDetail,
} from '@/features/monitoring/api/get-alarm-event';
import { useAlarmEventAction } from '@/features/monitoring/api/alarm-event-actions';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export { closeEventInputSchema };
export type CloseAlarmEventInput = z.input<typeof closeEventInputSchema>;
export type CloseAlarmEventVariables = { eventId: string; input: CloseAlarmEventInput };

/** Closes the event with how it ended; only the operator who took it may. */
export function closeAlarmEvent({ eventId, input }: CloseAlarmEventVariables) {
  return api.post(`${alarmEventUrl(eventId)}/close`, input, alarmEventDetailSchema);
}

export function useCloseAlarmEvent({
  mutationConfig,
}: { mutationConfig?: MutationConfig<AlarmEventDetail, CloseAlarmEventVariables> } = {}) {
  return useAlarmEventAction(closeAlarmEvent, mutationConfig);
}
