import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { saveSystemSchema, systemResponseSchema, type SystemRecord } from '@server/systems/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { refreshSiteChecks } from '@/lib/refresh-site-checks';
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
      // edited at all). A route loader would happily hand back a stale copy, so copies nobody is
      // watching are dropped and the next visit fetches them afresh; the system page's power
      // budget watches them, so those are fetched again in place.
      for (const section of ['zones', 'devices']) {
        const queryKey = siteQueryKeys.section(siteId, section);
        queryClient.removeQueries({ queryKey, type: 'inactive' });
        void queryClient.invalidateQueries({ queryKey });
      }
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.detail(siteId) });
      refreshSiteChecks(queryClient, siteId);
      return onSuccess?.(system, variables, ...rest);
    },
  });
}
