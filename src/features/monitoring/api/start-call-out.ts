import {
  alarmEventDetailSchema,
  alarmEventUrl,
  type AlarmEventDetail,
} from '@/features/monitoring/api/get-alarm-event';
import { useAlarmEventAction } from '@/features/monitoring/api/alarm-event-actions';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

/**
 * Starts texting the call plan's keyholders in order, moving on to the next after the centre's
 * wait. The event must be taken by the signed-in operator (409 otherwise).
 */
export function startCallOut(eventId: string) {
  return api.post(`${alarmEventUrl(eventId)}/call-out`, {}, alarmEventDetailSchema);
}

export function useStartCallOut({
  mutationConfig,
}: { mutationConfig?: MutationConfig<AlarmEventDetail, string> } = {}) {
  return useAlarmEventAction(startCallOut, mutationConfig);
}
