import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { siteDetailSchema } from '@server/sites/schema';
import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export async function getSite(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/sites/${encodeURIComponent(siteId)}`, siteDetailSchema, { signal });
}

export const getSiteQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: siteQueryKeys.detail(siteId),
    queryFn: ({ signal }) => getSite(siteId, { signal }),
  });

export const useSite = (siteId: string) => useSuspenseQuery(getSiteQueryOptions(siteId));
