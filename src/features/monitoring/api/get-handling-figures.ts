import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { monitoringQueryKeys } from '@/features/monitoring/api/monitoring-query-keys';
import { api } from '@/lib/api-client';

const periodFiguresSchema = z.object({
  events: z.number(),
  closed: z.number(),
  medianSecondsToTake: z.number().nullable(),
  p90SecondsToTake: z.number().nullable(),
  medianSecondsToClose: z.number().nullable(),
});
export type PeriodFigures = z.infer<typeof periodFiguresSchema>;

const handlingFiguresSchema = z.object({
  last24Hours: periodFiguresSchema,
  last7Days: periodFiguresSchema,
});
export type HandlingFigures = z.infer<typeof handlingFiguresSchema>;

/** How quickly the centre takes and closes events, over the last day and the last week. */
export function getHandlingFigures({ signal }: { signal?: AbortSignal } = {}) {
  return api.get('/api/monitoring/figures', handlingFiguresSchema, { signal });
}

export const getHandlingFiguresQueryOptions = () =>
  queryOptions({
    queryKey: monitoringQueryKeys.figures(),
    queryFn: ({ signal }) => getHandlingFigures({ signal }),
    // Medians over a day move slowly; once a minute is plenty.
    refetchInterval: 60_000,
    staleTime: 30_000,
  });

/** Not a suspense query: the queue matters more than its figures, and must not wait on them. */
export const useHandlingFigures = () => useQuery(getHandlingFiguresQueryOptions());
