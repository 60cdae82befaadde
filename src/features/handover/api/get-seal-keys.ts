import { sealKeysSchema } from '@server/handover/schema';
import { queryOptions, useQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';

/** Every installer's sealing public keys, current and retired, published for anyone to check. */
export async function getSealKeys({ signal }: { signal?: AbortSignal } = {}) {
  const { keys } = await api.get('/api/seal-keys', sealKeysSchema, { signal });
  return keys;
}

export const getSealKeysQueryOptions = () =>
  queryOptions({
    queryKey: ['seal-keys'],
    queryFn: ({ signal }) => getSealKeys({ signal }),
  });

/** Not suspending: the list is extra reading, and the page works without it. */
export const useSealKeys = () => useQuery(getSealKeysQueryOptions());
