import { alarmEventSchema } from '@server/monitoring/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { monitoringQueryKeys } from '@/features/monitoring/api/monitoring-query-keys';
import { api } from '@/lib/api-client';

export type QueueStatus = 'active' | 'closed';

const alarmEventListSchema = z.object({ events: z.array(alarmEventSchema) });

/** The centre's events: active ones by priority then age, or the most recently closed. */
export async function getAlarmEvents(
  status: QueueStatus,
  { signal }: { signal?: AbortSignal } = {},
) {
  const { events } = await api.get(
    `/api/monitoring/events?status=${status}`,
    alarmEventListSchema,
    { signal },
  );
  return events;
}

export const getAlarmEventsQueryOptions = (status: QueueStatus) =>
  queryOptions({
    queryKey: monitoringQueryKeys.list(status),
    queryFn: ({ signal }) => getAlarmEvents(status, { signal }),
    // The live stream refreshes the queue within a second; this is only a safety net should a
    // change ever be missed.
    refetchInterval: 60_000,
    staleTime: 5_000,
  });

export const useAlarmEvents = (status: QueueStatus) =>
  useSuspenseQuery(getAlarmEventsQueryOptions(status));
