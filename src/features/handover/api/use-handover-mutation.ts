import type { HandoverState } from '@server/handover/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { getHandoverQueryKey } from '@/features/handover/api/get-handover';
import type { MutationConfig } from '@/lib/query-client';

/**
 * A change to the handover draft: every one answers with the whole new state, which goes
 * straight into the cache so the page shows what the API now holds.
 */
export function useHandoverMutation<Variables extends { siteId: string }>(
  mutationFn: (variables: Variables) => Promise<HandoverState>,
  mutationConfig: MutationConfig<HandoverState, Variables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig;
  return useMutation({
    ...restConfig,
    mutationFn,
    onSuccess: async (state, variables, ...rest) => {
      queryClient.setQueryData(getHandoverQueryKey(variables.siteId), state);
      await onSuccess?.(state, variables, ...rest);
    },
  });
}
