import {
  changeRequestSchema,
  type ChangeRequest,
  type updateChangeRequestSchema,
} from '@server/change-requests/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import {
  changeRequestsUrl,
  getChangeRequestsQueryKey,
} from '@/features/change-requests/api/get-change-requests';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type UpdateChangeRequestVariables = {
  siteId: string;
  requestId: string;
  data: z.output<typeof updateChangeRequestSchema>;
};

/** Installer staff close a request once it is dealt with, or open it again. */
export function updateChangeRequest({ siteId, requestId, data }: UpdateChangeRequestVariables) {
  return api.patch(
    `${changeRequestsUrl(siteId)}/${encodeURIComponent(requestId)}`,
    data,
    changeRequestSchema,
  );
}

export function useUpdateChangeRequest({
  mutationConfig,
}: { mutationConfig?: MutationConfig<ChangeRequest, UpdateChangeRequestVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: updateChangeRequest,
    onSuccess: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: getChangeRequestsQueryKey(args[1].siteId) });
      await onSuccess?.(...args);
    },
  });
}
