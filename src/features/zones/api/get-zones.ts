import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { zoneScheduleSchema } from '@server/zones/schema';
import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

/** The site's zone schedule in order, with the areas a zone may be placed in. */
export async function getZones(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/sites/${encodeURIComponent(siteId)}/zones`, zoneScheduleSchema, {
    signal,
  });
}

export const getZonesQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: siteQueryKeys.section(siteId, 'zones'),
    queryFn: ({ signal }) => getZones(siteId, { signal }),
  });

export const useZones = (siteId: string) => useSuspenseQuery(getZonesQueryOptions(siteId));
