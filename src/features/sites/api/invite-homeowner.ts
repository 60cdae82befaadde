import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { inviteHomeownerSchema, siteDetailSchema, type SiteDetail } from '@server/sites/schema';
import { apiRequest } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export { inviteHomeownerSchema };
export type InviteHomeownerValues = z.output<typeof inviteHomeownerSchema>;
type InviteHomeownerVariables = { siteId: string; values: InviteHomeownerValues };

/** Creates or links the homeowner's account; the API e-mails them a link to set a password. */
export async function inviteHomeowner({
  siteId,
  values,
}: InviteHomeownerVariables): Promise<SiteDetail> {
  return apiRequest(`/api/sites/${encodeURIComponent(siteId)}/homeowners`, {
    method: 'POST',
    body: values,
    schema: siteDetailSchema,
  });
}

export function useInviteHomeowner(
  mutationConfig: MutationConfig<SiteDetail, InviteHomeownerVariables> = {},
) {
  const queryClient = useQueryClient();
  const { onSuccess, ...config } = mutationConfig;
  return useMutation({
    ...config,
    mutationFn: inviteHomeowner,
    onSuccess: (site, ...rest) => {
      queryClient.setQueryData(siteQueryKeys.detail(site.id), site);
      return onSuccess?.(site, ...rest);
    },
  });
}
