import { overdueListSchema } from '@server/service/schema';
import { queryOptions, useQuery } from '@tanstack/react-query';

import { serviceQueryKeys } from '@/features/service/api/service-query-keys';
import { api } from '@/lib/api-client';

/** The company's sites whose preventive visit is past due, the longest overdue first. */
export function getOverdueSites({ signal }: { signal?: AbortSignal } = {}) {
  return api.get('/api/service/overdue', overdueListSchema, { signal });
}

export const getOverdueSitesQueryOptions = () =>
  queryOptions({
    queryKey: serviceQueryKeys.overdue(),
    queryFn: ({ signal }) => getOverdueSites({ signal }),
  });

export const useOverdueSites = () => useQuery(getOverdueSitesQueryOptions());
