import {
  serviceVisitSchema,
  type ServiceVisit,
  type UpdateVisitInput,
} from '@server/service/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { invalidateServiceViews } from '@/features/service/api/book-visit';
import { api } from '@/lib/api-client';
import { isStaleEdit } from '@/lib/form-errors';
import type { MutationConfig } from '@/lib/query-client';

export type UpdateVisitVariables = { siteId: string; visitId: string; data: UpdateVisitInput };

/**
 * Assigns, moves or cancels a visit at the version the office saw; the API answers 409 when
 * someone else changed it since.
 */
export function updateVisit({ visitId, data }: UpdateVisitVariables) {
  return api.patch(`/api/service/visits/${encodeURIComponent(visitId)}`, data, serviceVisitSchema);
}

export function useUpdateVisit({
  mutationConfig,
}: { mutationConfig?: MutationConfig<ServiceVisit, UpdateVisitVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, onError, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: updateVisit,
    onSuccess: async (...args) => {
      await invalidateServiceViews(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
    onError: async (...args) => {
      // Someone else changed the visit: show what is saved now beside the form, which keeps
      // what this person typed until they choose to reload it.
      if (isStaleEdit(args[0])) await invalidateServiceViews(queryClient, args[1].siteId);
      await onError?.(...args);
    },
  });
}
