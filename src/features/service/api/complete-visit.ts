import {
  completedVisitSchema,
  type CompletedVisit,
  type CompleteVisitInput,
} from '@server/service/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { invalidateServiceViews } from '@/features/service/api/book-visit';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type CompleteVisitVariables = { siteId: string; visitId: string; data: CompleteVisitInput };

/**
 * Sends the engineer's completed form. The body carries the key made on the phone, so sending it
 * again after a dropped connection answers with the visit it already completed.
 */
export function completeVisit({ visitId, data }: CompleteVisitVariables) {
  return api.post(
    `/api/service/visits/${encodeURIComponent(visitId)}/complete`,
    data,
    completedVisitSchema,
  );
}

export function useCompleteVisit({
  mutationConfig,
}: { mutationConfig?: MutationConfig<CompletedVisit, CompleteVisitVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: completeVisit,
    onSuccess: async (...args) => {
      await invalidateServiceViews(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
