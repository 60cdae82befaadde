import { serviceVisitSchema } from '@server/service/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { invalidateServiceViews } from '@/features/service/api/book-visit';
import { api } from '@/lib/api-client';

export type BookCalloutVariables = { siteId: string; faultReportId: string; clientKey: string };

/** Books a call-out from a homeowner's fault report; the key makes a resend book it once. */
export function bookCallout({ siteId, faultReportId, clientKey }: BookCalloutVariables) {
  return api.post(
    `/api/sites/${encodeURIComponent(siteId)}/service/callouts`,
    { faultReportId, clientKey },
    serviceVisitSchema,
  );
}

export function useBookCallout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: bookCallout,
    onSuccess: (_visit, variables) => invalidateServiceViews(queryClient, variables.siteId),
  });
}
