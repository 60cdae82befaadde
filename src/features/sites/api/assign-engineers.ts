import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { assignEngineersSchema, siteDetailSchema, type SiteDetail } from '@server/sites/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

type AssignEngineersVariables = { siteId: string } & z.output<typeof assignEngineersSchema>;

export async function assignEngineers({
  siteId,
  userIds,
}: AssignEngineersVariables): Promise<SiteDetail> {
  return apiRequest(`/api/sites/${encodeURIComponent(siteId)}/engineers`, {
    method: 'PUT',
    body: assignEngineersSchema.parse({ userIds }),
    schema: siteDetailSchema,
  });
}

export function useAssignEngineers(
  mutationConfig: MutationConfig<SiteDetail, AssignEngineersVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: assignEngineers,
    onSuccess: (site, ...rest) => {
      queryClient.setQueryData(siteQueryKeys.detail(site.id), site);
      // The list shows each site's engineers and can be filtered by them.
      void queryClient.invalidateQueries({ queryKey: siteQueryKeys.lists() });
      return onSuccess?.(site, ...rest);
    },
  });
}
