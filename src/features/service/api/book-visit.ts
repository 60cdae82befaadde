import {
  serviceVisitSchema,
  type ScheduleVisitInput,
  type ServiceVisit,
} from '@server/service/schema';
import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';

import { serviceQueryKeys } from '@/features/service/api/service-query-keys';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type BookVisitVariables = { siteId: string; data: ScheduleVisitInput };

/**
 * Books a preventive visit or a call-out. The body carries a key made for this booking, so a
 * resend after a dropped connection books it once.
 */
export function bookVisit({ siteId, data }: BookVisitVariables) {
  return api.post(
    `/api/sites/${encodeURIComponent(siteId)}/service/visits`,
    data,
    serviceVisitSchema,
  );
}

/** The schedule, the overdue list and the site's plan (its booked visit) all change. */
export async function invalidateServiceViews(queryClient: QueryClient, siteId: string) {
  await Promise.all([
    queryClient.invalidateQueries({ queryKey: serviceQueryKeys.all }),
    queryClient.invalidateQueries({ queryKey: serviceQueryKeys.plan(siteId) }),
  ]);
}

export function useBookVisit({
  mutationConfig,
}: { mutationConfig?: MutationConfig<ServiceVisit, BookVisitVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: bookVisit,
    onSuccess: async (...args) => {
      await invalidateServiceViews(queryClient, args[1].siteId);
      await onSuccess?.(...args);
    },
  });
}
