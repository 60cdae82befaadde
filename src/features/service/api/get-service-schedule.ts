import { scheduleSchema } from '@server/service/schema';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';

import { serviceQueryKeys } from '@/features/service/api/service-query-keys';
import { api } from '@/lib/api-client';

/** The days asked for (at most a quarter, MAX_SCHEDULE_DAYS) and, optionally, one engineer. */
export type ScheduleRange = { from: string; to: string; engineerId?: string };

export function getServiceSchedule(
  range: ScheduleRange,
  { signal }: { signal?: AbortSignal } = {},
) {
  const query = new URLSearchParams({ from: range.from, to: range.to });
  if (range.engineerId) query.set('engineerId', range.engineerId);
  return api.get(`/api/service/visits?${query}`, scheduleSchema, { signal });
}

export const getServiceScheduleQueryOptions = (range: ScheduleRange) =>
  queryOptions({
    queryKey: serviceQueryKeys.schedule(range),
    queryFn: ({ signal }) => getServiceSchedule(range, { signal }),
    // Keep last month's visits on screen while the next month is on its way.
    placeholderData: keepPreviousData,
  });

export const useServiceSchedule = (range: ScheduleRange) =>
  useQuery(getServiceScheduleQueryOptions(range));
