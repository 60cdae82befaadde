import { keyholderListSchema, type Keyholder } from '@server/keyholders/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { getKeyholdersQueryKey, keyholdersUrl } from '@/features/keyholders/api/get-keyholders';
import { invalidateKeyholders } from '@/features/keyholders/api/invalidate-keyholders';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type ReorderKeyholdersVariables = { siteId: string; keyholderIds: string[] };

/** Sends the whole call plan in its new order (every keyholder's id, first called first). */
export async function reorderKeyholders({ siteId, keyholderIds }: ReorderKeyholdersVariables) {
  const { keyholders } = await api.put(
    `${keyholdersUrl(siteId)}/order`,
    { keyholderIds },
    keyholderListSchema,
  );
  return keyholders;
}

const reorderMutationKey = ['keyholders', 'reorder'];

type RollbackContext = { previous: Keyholder[] | undefined };

/**
 * The new order shows at once, so a run of "Move up" presses feels immediate; if the API refuses,
 * the plan goes back to what it was and the error is shown.
 */
export function useReorderKeyholders({
  mutationConfig,
}: {
  mutationConfig?: Omit<
    MutationConfig<Keyholder[], ReorderKeyholdersVariables>,
    'onMutate' | 'onError' | 'onSettled'
  >;
} = {}) {
  const queryClient = useQueryClient();
  return useMutation<Keyholder[], Error, ReorderKeyholdersVariables, RollbackContext>({
    ...mutationConfig,
    mutationKey: reorderMutationKey,
    // One at a time, so a quick run of moves reaches the API in the order they were made.
    scope: { id: 'keyholder-order' },
    mutationFn: reorderKeyholders,
    onMutate: async ({ siteId, keyholderIds }) => {
      const queryKey = getKeyholdersQueryKey(siteId);
      await queryClient.cancelQueries({ queryKey });
      const previous = queryClient.getQueryData<Keyholder[]>(queryKey);
      if (previous) {
        const byId = new Map(previous.map((keyholder) => [keyholder.id, keyholder]));
        const reordered = keyholderIds
          .map((id) => byId.get(id))
          .filter((keyholder): keyholder is Keyholder => keyholder !== undefined)
          .map((keyholder, index) => ({ ...keyholder, callOrder: index + 1 }));
        queryClient.setQueryData(queryKey, reordered);
      }
      return { previous };
    },
    onError: (_error, { siteId }, context) => {
      if (context?.previous) {
        queryClient.setQueryData(getKeyholdersQueryKey(siteId), context.previous);
      }
    },
    onSuccess: (keyholders, { siteId }) => {
      queryClient.setQueryData(getKeyholdersQueryKey(siteId), keyholders);
    },
    onSettled: async (_data, _error, { siteId }) => {
      // Refetching between queued moves would flash an order the person has already changed.
      if (queryClient.isMutating({ mutationKey: reorderMutationKey }) > 1) return;
      await invalidateKeyholders(queryClient, siteId);
    },
  });
}
