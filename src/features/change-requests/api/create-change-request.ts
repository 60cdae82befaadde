import {
  changeRequestSchema,
  type ChangeRequest,
  type createChangeRequestSchema,
} from '@server/change-requests/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import {
  changeRequestsUrl,
  getChangeRequestsQueryKey,
} from '@/features/change-requests/api/get-change-requests';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type CreateChangeRequestVariables = {
  siteId: string;
  data: z.output<typeof createChangeRequestSchema>;
};

/** A homeowner asks their alarm company for a change. */
export function createChangeRequest({ siteId, data }: CreateChangeRequestVariables) {
  return api.post(changeRequestsUrl(siteId), data, changeRequestSchema);
}

export function useCreateChangeRequest({
  mutationConfig,
}: { mutationConfig?: MutationConfig<ChangeRequest, CreateChangeRequestVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: createChangeRequest,
    onSuccess: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: getChangeRequestsQueryKey(args[1].siteId) });
      await onSuccess?.(...args);
    },
  });
}
