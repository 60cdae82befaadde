import { keyholderListSchema } from '@server/keyholders/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export const keyholdersUrl = (siteId: string) =>
  `/api/sites/${encodeURIComponent(siteId)}/keyholders`;

/** The call plan, first to be called first. */
export async function getKeyholders(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  const { keyholders } = await api.get(keyholdersUrl(siteId), keyholderListSchema, { signal });
  return keyholders;
}

export const getKeyholdersQueryKey = (siteId: string) =>
  siteQueryKeys.section(siteId, 'keyholders');

export const getKeyholdersQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: getKeyholdersQueryKey(siteId),
    queryFn: ({ signal }) => getKeyholders(siteId, { signal }),
  });

export const useKeyholders = (siteId: string) =>
  useSuspenseQuery(getKeyholdersQueryOptions(siteId));
