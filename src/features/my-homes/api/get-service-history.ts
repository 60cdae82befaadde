import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { serviceHistorySchema } from '@server/service-history/schema';
import { getMyHomesQueryKey } from '@/features/my-homes/api/get-my-homes';
import { api } from '@/lib/api-client';

export const getServiceHistoryQueryKey = (siteId: string) =>
  [...getMyHomesQueryKey(), siteId, 'service-history'] as const;

/** The home's visits, fault reports and handover packs, newest first. */
export function getServiceHistory(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(
    `/api/my/homes/${encodeURIComponent(siteId)}/service-history`,
    serviceHistorySchema,
    { signal },
  );
}

export const getServiceHistoryQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: getServiceHistoryQueryKey(siteId),
    queryFn: ({ signal }) => getServiceHistory(siteId, { signal }),
  });

export const useServiceHistory = (siteId: string) =>
  useSuspenseQuery(getServiceHistoryQueryOptions(siteId));
