import { keyholdingListSchema } from '@server/my/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';

/** The sites the signed-in keyholder holds keys for, and only what a keyholder needs of each. */
export async function getMyKeyholdings({ signal }: { signal?: AbortSignal } = {}) {
  const { keyholdings } = await api.get('/api/my/keyholdings', keyholdingListSchema, { signal });
  return keyholdings;
}

export const getMyKeyholdingsQueryOptions = () =>
  queryOptions({
    queryKey: ['my', 'keyholdings'] as const,
    queryFn: ({ signal }) => getMyKeyholdings({ signal }),
  });

export const useMyKeyholdings = () => useSuspenseQuery(getMyKeyholdingsQueryOptions());
