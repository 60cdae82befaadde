import { queryOptions, useQuery } from '@tanstack/react-query';
import { z } from 'zod';

import { api } from '@/lib/api-client';

const monitoringCentresSchema = z.object({
  monitoringCentres: z.array(z.object({ id: z.string(), name: z.string() })),
});

export type MonitoringCentreChoice = z.infer<
  typeof monitoringCentresSchema
>['monitoringCentres'][number];

export async function getMonitoringCentres({ signal }: { signal?: AbortSignal } = {}) {
  const { monitoringCentres } = await api.get('/api/monitoring-centres', monitoringCentresSchema, {
    signal,
  });
  return monitoringCentres;
}

export const getMonitoringCentresQueryOptions = () =>
  queryOptions({
    queryKey: ['monitoring-centres'],
    queryFn: ({ signal }) => getMonitoringCentres({ signal }),
    staleTime: 10 * 60_000,
  });

export const useMonitoringCentres = () => useQuery(getMonitoringCentresQueryOptions());
