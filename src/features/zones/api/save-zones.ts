import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { saveZonesSchema, zoneScheduleSchema, type ZoneSchedule } from '@server/zones/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { refreshSiteChecks } from '@/lib/refresh-site-checks';
import { siteQueryKeys } from '@/lib/site-query-keys';

export { saveZonesSchema };
export type SaveZonesValues = z.output<typeof saveZonesSchema>;
type SaveZonesVariables = { siteId: string; values: SaveZonesValues };

/**
 * Saves the whole schedule at once: array order is schedule order, rows keep their `id`, rows
 * without one are new and rows left out are deleted.
 */
export async function saveZones({ siteId, values }: SaveZonesVariables): Promise<ZoneSchedule> {
  return apiRequest(`/api/sites/${encodeURIComponent(siteId)}/zones`, {
    method: 'PUT',
    body: values,
    schema: zoneScheduleSchema,
  });
}

export function useSaveZones(
  mutationConfig: MutationConfig<ZoneSchedule, SaveZonesVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: saveZones,
    onSuccess: (schedule, variables, ...rest) => {
      queryClient.setQueryData(siteQueryKeys.section(variables.siteId, 'zones'), schedule);
      // The site's zone count shows in its header and in the list.
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.detail(variables.siteId) });
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.lists() });
      refreshSiteChecks(queryClient, variables.siteId);
      return onSuccess?.(schedule, variables, ...rest);
    },
  });
}
