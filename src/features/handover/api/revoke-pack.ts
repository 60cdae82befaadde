import { packSummarySchema, type PackSummary } from '@server/handover/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { getHandoverQueryKey } from '@/features/handover/api/get-handover';
import { getMyDocumentsQueryKey } from '@/features/handover/api/get-my-documents';
import { getVerificationQueryKey } from '@/features/handover/api/get-verification';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type RevokePackVariables = { packNumber: string; reason: string };

/** Withdraws an issued pack (office only): it stays on record, marked revoked with the reason. */
export function revokePack({ packNumber, reason }: RevokePackVariables) {
  return api.post(
    `/api/packs/${encodeURIComponent(packNumber)}/revoke`,
    { reason },
    packSummarySchema,
  );
}

export function useRevokePack(
  mutationConfig: MutationConfig<PackSummary, RevokePackVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig;
  return useMutation({
    ...restConfig,
    mutationFn: revokePack,
    onSuccess: async (pack, ...rest) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: getHandoverQueryKey(pack.siteId) }),
        queryClient.invalidateQueries({ queryKey: getMyDocumentsQueryKey() }),
        queryClient.invalidateQueries({ queryKey: getVerificationQueryKey(pack.packNumber) }),
      ]);
      await onSuccess?.(pack, ...rest);
    },
  });
}
