import { zoneScheduleSchema } from '@server/zones/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { getMyHomesQueryKey } from '@/features/my-homes/api/get-my-homes';
import { api } from '@/lib/api-client';

/** The zone schedule, read-only, for the homeowner's own pages. */
export function getHomeZones(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/sites/${encodeURIComponent(siteId)}/zones`, zoneScheduleSchema, { signal });
}

export const getHomeZonesQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: [...getMyHomesQueryKey(), siteId, 'zones'] as const,
    queryFn: ({ signal }) => getHomeZones(siteId, { signal }),
  });

export const useHomeZones = (siteId: string) => useSuspenseQuery(getHomeZonesQueryOptions(siteId));
