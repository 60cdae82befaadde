import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { deviceListSchema } from '@server/devices/schema';
import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

/** Keypads, sounders, expanders, communicators and remote power supplies, in order. */
export async function getDevices(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/sites/${encodeURIComponent(siteId)}/devices`, deviceListSchema, {
    signal,
  });
}

export const getDevicesQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: siteQueryKeys.section(siteId, 'devices'),
    queryFn: ({ signal }) => getDevices(siteId, { signal }),
  });

export const useDevices = (siteId: string) => useSuspenseQuery(getDevicesQueryOptions(siteId));
