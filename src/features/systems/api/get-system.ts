import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { systemResponseSchema } from '@server/systems/schema';
import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

/** The site's control panel, power supply, signalling and areas; null until first recorded. */
export async function getSystem(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  const { system } = await api.get(
    `/api/sites/${encodeURIComponent(siteId)}/system`,
    systemResponseSchema,
    { signal },
  );
  return system;
}

export const getSystemQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: siteQueryKeys.section(siteId, 'system'),
    queryFn: ({ signal }) => getSystem(siteId, { signal }),
  });

export const useSystem = (siteId: string) => useSuspenseQuery(getSystemQueryOptions(siteId));
