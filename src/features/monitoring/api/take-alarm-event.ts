import {
  alarmEventDetailSchema,
  alarmEventUrl,
  type AlarmEventDetail,
} from '@/features/monitoring/api/get-alarm-event';
import { useAlarmEventAction } from '@/features/monitoring/api/alarm-event-actions';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

/** Locks the event to the signed-in operator; 409 names whoever has it already. */
export function takeAlarmEvent(eventId: string) {
  return api.post(`${alarmEventUrl(eventId)}/take`, undefined, alarmEventDetailSchema);
}

export function useTakeAlarmEvent({
  mutationConfig,
}: { mutationConfig?: MutationConfig<AlarmEventDetail, string> } = {}) {
  return useAlarmEventAction(takeAlarmEvent, mutationConfig);
}
