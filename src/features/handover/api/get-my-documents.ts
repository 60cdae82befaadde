import { documentsSchema } from '@server/handover/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';

/** Every handover pack of every home the signed-in homeowner is linked to. */
export async function getMyDocuments({ signal }: { signal?: AbortSignal } = {}) {
  const { packs } = await api.get('/api/my/documents', documentsSchema, { signal });
  return packs;
}

export const getMyDocumentsQueryKey = () => ['my', 'documents'] as const;

export const getMyDocumentsQueryOptions = () =>
  queryOptions({
    queryKey: getMyDocumentsQueryKey(),
    queryFn: ({ signal }) => getMyDocuments({ signal }),
  });

export const useMyDocuments = () => useSuspenseQuery(getMyDocumentsQueryOptions());
