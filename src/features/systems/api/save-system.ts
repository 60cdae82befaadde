import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { saveSystemSchema, systemResponseSchema, type SystemRecord } from '@server/systems/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export { saveSystemSchema };
export type SaveSystemValues = z.output<typeof saveSystemSchema>;
type SaveSystemVariables = { siteId: string; values: SaveSystemValues };

export async function saveSystem({ siteId, values }: SaveSystemVariables) {
  const { system } = await apiRequest(`/api/sites/${encodeURIComponent(siteId)}/system`, {
    method: 'PUT',
    body: values,
    schema: systemResponseSchema,
  });
  if (!system) throw new Error('The API saved the system but did not send it back.');
  return system;
}

export function useSaveSystem(
  mutationConfig: MutationConfig<SystemRecord, SaveSystemVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: saveSystem,
    onSuccess: (system, variables, ...rest) => {
      const { siteId } = variables;
      queryClient.setQueryData(siteQueryKeys.section(siteId, 'system'), system);
      // The zone schedule and device list hang on the system (its areas, and whether they can be
      // edited at all). Neither is on screen now, and a route loader would happily hand back a
      // stale copy, so drop them: the next visit fetches them afresh.
      queryClient.removeQueries({ queryKey: siteQueryKeys.section(siteId, 'zones') });
      queryClient.removeQueries({ queryKey: siteQueryKeys.section(siteId, 'devices') });
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.detail(siteId) });
      return onSuccess?.(system, variables, ...rest);
    },
  });
}
