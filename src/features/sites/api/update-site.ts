import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { siteDetailSchema, type SiteDetail, type updateSiteSchema } from '@server/sites/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { refreshSiteChecks } from '@/lib/refresh-site-checks';
import { siteQueryKeys } from '@/lib/site-query-keys';

export type UpdateSiteValues = z.output<typeof updateSiteSchema>;
type UpdateSiteVariables = { siteId: string; values: UpdateSiteValues };

export async function updateSite({ siteId, values }: UpdateSiteVariables): Promise<SiteDetail> {
  return apiRequest(`/api/sites/${encodeURIComponent(siteId)}`, {
    method: 'PATCH',
    body: values,
    schema: siteDetailSchema,
  });
}

export function useUpdateSite(
  mutationConfig: MutationConfig<SiteDetail, UpdateSiteVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: updateSite,
    onSuccess: (site, ...rest) => {
      queryClient.setQueryData(siteQueryKeys.detail(site.id), site);
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.lists() });
      // The required grade, class and police response feed the engineering and pre-issue checks.
      refreshSiteChecks(queryClient, site.id);
      return onSuccess?.(site, ...rest);
    },
  });
}
