import { faultQueueSchema } from '@server/faults/schema';
import { queryOptions, useQuery } from '@tanstack/react-query';

import { serviceQueryKeys } from '@/features/service/api/service-query-keys';
import { api } from '@/lib/api-client';

/** Faults homeowners have reported to the company, for the office to book call-outs from. */
export function getFaultQueue({ signal }: { signal?: AbortSignal } = {}) {
  return api.get('/api/service/faults', faultQueueSchema, { signal });
}

export const getFaultQueueQueryOptions = () =>
  queryOptions({
    queryKey: serviceQueryKeys.faults(),
    queryFn: ({ signal }) => getFaultQueue({ signal }),
  });

export const useFaultQueue = () => useQuery(getFaultQueueQueryOptions());
