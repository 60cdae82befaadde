import { useMutation, useQueryClient } from '@tanstack/react-query';

import { siteDetailSchema, type SiteDetail } from '@server/sites/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

type RemoveHomeownerVariables = { siteId: string; userId: string };

/** Unlinks the homeowner from this site; their account stays for any other home they have. */
export async function removeHomeowner({
  siteId,
  userId,
}: RemoveHomeownerVariables): Promise<SiteDetail> {
  return apiRequest(
    `/api/sites/${encodeURIComponent(siteId)}/homeowners/${encodeURIComponent(userId)}`,
    { method: 'DELETE', schema: siteDetailSchema },
  );
}

export function useRemoveHomeowner(
  mutationConfig: MutationConfig<SiteDetail, RemoveHomeownerVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: removeHomeowner,
    onSuccess: (site, ...rest) => {
      queryClient.setQueryData(siteQueryKeys.detail(site.id), site);
      return onSuccess?.(site, ...rest);
    },
  });
}
