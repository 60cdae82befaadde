import { keyholderSchema, type Keyholder } from '@server/keyholders/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { keyholdersUrl } from '@/features/keyholders/api/get-keyholders';
import { invalidateKeyholders } from '@/features/keyholders/api/invalidate-keyholders';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type ConfirmKeyholderVariables = { siteId: string; keyholderId: string };

/** Records that someone has just checked this keyholder's details are still right. */
export function confirmKeyholder({ siteId, keyholderId }: ConfirmKeyholderVariables) {
  return api.post(
    `${keyholdersUrl(siteId)}/${encodeURIComponent(keyholderId)}/confirm`,
    undefined,
    keyholderSchema,
  );
}

export function useConfirmKeyholder({
  mutationConfig,
}: { mutationConfig?: MutationConfig<Keyholder, ConfirmKeyholderVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: confirmKeyholder,
    onSuccess: async (...args) => {
      await invalidateKeyholders(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
