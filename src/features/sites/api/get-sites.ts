import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';

import { siteListSchema } from '@server/sites/schema';
import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';
import { siteListApiQuery, type SiteListFilters } from '@/features/sites/utils/list-filters';

export async function getSites(
  filters: SiteListFilters,
  { signal }: { signal?: AbortSignal } = {},
) {
  return api.get(`/api/sites?${siteListApiQuery(filters)}`, siteListSchema, { signal });
}

export const getSitesQueryOptions = (filters: SiteListFilters) =>
  queryOptions({
    queryKey: siteQueryKeys.list(filters),
    queryFn: ({ signal }) => getSites(filters, { signal }),
    // Keep the rows on screen while the next page, sort or search is on its way.
    placeholderData: keepPreviousData,
  });

export const useSites = (filters: SiteListFilters) => useQuery(getSitesQueryOptions(filters));
