import {
  keyholderSchema,
  type Keyholder,
  type updateKeyholderSchema,
} from '@server/keyholders/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { keyholdersUrl } from '@/features/keyholders/api/get-keyholders';
import { invalidateKeyholders } from '@/features/keyholders/api/invalidate-keyholders';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type UpdateKeyholderVariables = {
  siteId: string;
  keyholderId: string;
  data: z.output<typeof updateKeyholderSchema>;
};

/** Saves changed details; the API answers 409 if the version sent is no longer the latest. */
export function updateKeyholder({ siteId, keyholderId, data }: UpdateKeyholderVariables) {
  return api.patch(
    `${keyholdersUrl(siteId)}/${encodeURIComponent(keyholderId)}`,
    data,
    keyholderSchema,
  );
}

export function useUpdateKeyholder({
  mutationConfig,
}: { mutationConfig?: MutationConfig<Keyholder, UpdateKeyholderVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: updateKeyholder,
    onSuccess: async (...args) => {
      await invalidateKeyholders(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
