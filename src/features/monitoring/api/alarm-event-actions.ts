import type { AlarmEvent } from '@server/monitoring/schema';
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';

import type { AlarmEventDetail } from '@/features/monitoring/api/get-alarm-event';
import { monitoringQueryKeys } from '@/features/monitoring/api/monitoring-query-keys';
import type { MutationConfig } from '@/lib/query-client';

/**
 * Every action on an event answers with the event as it now stands: keep that as the event's
 * screen, put it into the cached queue at once (so going back never shows it as it was), and
 * have the queue refetched, since its order or tab may have changed with it.
 */
export async function storeAlarmEvent(queryClient: QueryClient, detail: AlarmEventDetail) {
  const { event } = detail;
  queryClient.setQueryData(monitoringQueryKeys.detail(event.id), detail);
  queryClient.setQueryData<AlarmEvent[]>(monitoringQueryKeys.list('active'), (events) =>
    events
      ?.filter((queued) => queued.id !== event.id || event.status !== 'closed')
      .map((queued) => (queued.id === event.id ? event : queued)),
  );
  await queryClient.invalidateQueries({ queryKey: monitoringQueryKeys.lists() });
}

/** The hook for one action on an event (take, close, call-out, …): the answer is stored. */
export function useAlarmEventAction<Variables>(
  action: (variables: Variables) => Promise<AlarmEventDetail>,
  mutationConfig: MutationConfig<AlarmEventDetail, Variables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig;
  return useMutation({
    ...restConfig,
    mutationFn: action,
    onSuccess: async (...args) => {
      await storeAlarmEvent(queryClient, args[0]);
      await onSuccess?.(...args);
    },
  });
}
