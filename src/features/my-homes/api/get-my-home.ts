import { myHomeSchema } from '@server/my/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { getMyHomesQueryKey } from '@/features/my-homes/api/get-my-homes';
import { api } from '@/lib/api-client';

/** One of the homeowner's sites; the API answers 404 for anyone else's. */
export function getMyHome(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/my/homes/${encodeURIComponent(siteId)}`, myHomeSchema, { signal });
}

export const getMyHomeQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: [...getMyHomesQueryKey(), siteId] as const,
    queryFn: ({ signal }) => getMyHome(siteId, { signal }),
  });

export const useMyHome = (siteId: string) => useSuspenseQuery(getMyHomeQueryOptions(siteId));
