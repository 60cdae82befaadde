import { useMutation, useQueryClient } from '@tanstack/react-query';

import { keyholdersUrl } from '@/features/keyholders/api/get-keyholders';
import { invalidateKeyholders } from '@/features/keyholders/api/invalidate-keyholders';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type DeleteKeyholderVariables = { siteId: string; keyholderId: string };

/** Removes a keyholder; everyone after them moves up one place. */
export function deleteKeyholder({ siteId, keyholderId }: DeleteKeyholderVariables) {
  return api.delete(`${keyholdersUrl(siteId)}/${encodeURIComponent(keyholderId)}`);
}

export function useDeleteKeyholder({
  mutationConfig,
}: { mutationConfig?: MutationConfig<undefined, DeleteKeyholderVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: deleteKeyholder,
    onSuccess: async (...args) => {
      await invalidateKeyholders(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
