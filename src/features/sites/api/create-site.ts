import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { createSiteSchema, siteDetailSchema, type SiteDetail } from '@server/sites/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export { createSiteSchema };
export type CreateSiteValues = z.output<typeof createSiteSchema>;

export async function createSite(values: CreateSiteValues): Promise<SiteDetail> {
  return apiRequest('/api/sites', { method: 'POST', body: values, schema: siteDetailSchema });
}

export function useCreateSite(mutationConfig: MutationConfig<SiteDetail, CreateSiteValues> = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: createSite,
    onSuccess: (site, ...rest) => {
      queryClient.setQueryData(siteQueryKeys.detail(site.id), site);
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.lists() });
      return onSuccess?.(site, ...rest);
    },
  });
}
