import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { deviceListSchema, saveDevicesSchema } from '@server/devices/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { refreshSiteChecks } from '@/lib/refresh-site-checks';
import { siteQueryKeys } from '@/lib/site-query-keys';

export { saveDevicesSchema };
export type SaveDevicesValues = z.output<typeof saveDevicesSchema>;
export type DeviceList = z.output<typeof deviceListSchema>;
type SaveDevicesVariables = { siteId: string; values: SaveDevicesValues };

/** Saves the whole list at once, like the zone schedule: order, ids kept, missing rows deleted. */
export async function saveDevices({ siteId, values }: SaveDevicesVariables): Promise<DeviceList> {
  return apiRequest(`/api/sites/${encodeURIComponent(siteId)}/devices`, {
    method: 'PUT',
    body: values,
    schema: deviceListSchema,
  });
}

export function useSaveDevices(
  mutationConfig: MutationConfig<DeviceList, SaveDevicesVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: saveDevices,
    onSuccess: (devices, variables, ...rest) => {
      queryClient.setQueryData(siteQueryKeys.section(variables.siteId, 'devices'), devices);
      // The device count shows in the site's header.
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.detail(variables.siteId) });
      // The power budget, grade and pre-issue check count the devices.
      refreshSiteChecks(queryClient, variables.siteId);
      return onSuccess?.(devices, variables, ...rest);
    },
  });
}
