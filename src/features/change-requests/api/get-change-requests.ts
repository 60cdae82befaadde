import { changeRequestListSchema } from '@server/change-requests/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export const changeRequestsUrl = (siteId: string) =>
  `/api/sites/${encodeURIComponent(siteId)}/change-requests`;

/** What the homeowner has asked the installer to change, newest first. */
export async function getChangeRequests(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  const { changeRequests } = await api.get(changeRequestsUrl(siteId), changeRequestListSchema, {
    signal,
  });
  return [...changeRequests].sort((a, b) => b.createdAt.localeCompare(a.createdAt));
}

export const getChangeRequestsQueryKey = (siteId: string) =>
  siteQueryKeys.section(siteId, 'change-requests');

export const getChangeRequestsQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: getChangeRequestsQueryKey(siteId),
    queryFn: ({ signal }) => getChangeRequests(siteId, { signal }),
  });

export const useChangeRequests = (siteId: string) =>
  useSuspenseQuery(getChangeRequestsQueryOptions(siteId));
