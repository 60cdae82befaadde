import { myHomeListSchema } from '@server/my/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';

/** Every site the signed-in homeowner is linked to, with who to call about each. */
export async function getMyHomes({ signal }: { signal?: AbortSignal } = {}) {
  const { homes } = await api.get('/api/my/homes', myHomeListSchema, { signal });
  return homes;
}

export const getMyHomesQueryKey = () => ['my', 'homes'] as const;

export const getMyHomesQueryOptions = () =>
  queryOptions({
    queryKey: getMyHomesQueryKey(),
    queryFn: ({ signal }) => getMyHomes({ signal }),
  });

export const useMyHomes = () => useSuspenseQuery(getMyHomesQueryOptions());
