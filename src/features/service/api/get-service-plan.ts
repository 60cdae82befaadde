import { servicePlanSchema } from '@server/service/schema';
import { queryOptions, useQuery } from '@tanstack/react-query';

import { serviceQueryKeys } from '@/features/service/api/service-query-keys';
import { api } from '@/lib/api-client';

/** The plan the site's signalling calls for: visits a year, next due, overdue. */
export function getServicePlan(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  return api.get(`/api/sites/${encodeURIComponent(siteId)}/service-plan`, servicePlanSchema, {
    signal,
  });
}

export const getServicePlanQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: serviceQueryKeys.plan(siteId),
    queryFn: ({ signal }) => getServicePlan(siteId, { signal }),
  });

/** Not a suspense query: the overview it sits on must open even if the plan cannot be had. */
export const useServicePlan = (siteId: string | undefined) =>
  useQuery({ ...getServicePlanQueryOptions(siteId ?? ''), enabled: Boolean(siteId) });
