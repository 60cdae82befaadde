import { handoverStateSchema } from '@server/handover/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export const handoverUrl = (siteId: string) => `/api/sites/${encodeURIComponent(siteId)}/handover`;

/** The handover draft (made on first visit), the packs issued, and what still stands in the way. */
export async function getHandover(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(handoverUrl(siteId), handoverStateSchema, { signal });
}

export const getHandoverQueryKey = (siteId: string) => siteQueryKeys.section(siteId, 'handover');

export const getHandoverQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: getHandoverQueryKey(siteId),
    queryFn: ({ signal }) => getHandover(siteId, { signal }),
    // What blocks the pack is worked out from the whole record: fetched on each visit.
    staleTime: 0,
  });

export const useHandover = (siteId: string) => useSuspenseQuery(getHandoverQueryOptions(siteId));
