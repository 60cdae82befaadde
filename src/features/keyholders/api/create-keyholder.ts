import {
  keyholderSchema,
  type createKeyholderSchema,
  type Keyholder,
} from '@server/keyholders/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { keyholdersUrl } from '@/features/keyholders/api/get-keyholders';
import { invalidateKeyholders } from '@/features/keyholders/api/invalidate-keyholders';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type CreateKeyholderVariables = {
  siteId: string;
  data: z.output<typeof createKeyholderSchema>;
};

/** Adds a keyholder at the end of the call plan. */
export function createKeyholder({ siteId, data }: CreateKeyholderVariables) {
  return api.post(keyholdersUrl(siteId), data, keyholderSchema);
}

export function useCreateKeyholder({
  mutationConfig,
}: { mutationConfig?: MutationConfig<Keyholder, CreateKeyholderVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: createKeyholder,
    onSuccess: async (...args) => {
      await invalidateKeyholders(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
