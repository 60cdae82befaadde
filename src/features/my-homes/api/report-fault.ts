import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { z } from 'zod';

import { reportedFaultSchema } from '@server/faults/schema';
import { getServiceHistoryQueryKey } from '@/features/my-homes/api/get-service-history';
import { apiUpload } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type ReportedFault = z.infer<typeof reportedFaultSchema>;
export type ReportFaultVariables = {
  siteId: string;
  description: string;
  /** Made on the phone for this report: sent twice, it is recorded once. */
  clientKey: string;
  photos: readonly File[];
};

/** Sends the report and its photos as one multipart request, so nothing arrives half-made. */
export function reportFault({ siteId, description, clientKey, photos }: ReportFaultVariables) {
  const body = new FormData();
  // The fields go first so the server has them before the photos' bytes stream in.
  body.append('description', description);
  body.append('clientKey', clientKey);
  for (const photo of photos) body.append('photos', photo, photo.name);
  return apiUpload(`/api/my/homes/${encodeURIComponent(siteId)}/faults`, {
    body,
    schema: reportedFaultSchema,
  });
}

export function useReportFault({
  mutationConfig,
}: { mutationConfig?: MutationConfig<ReportedFault, ReportFaultVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: reportFault,
    onSuccess: async (...args) => {
      await queryClient.invalidateQueries({ queryKey: getServiceHistoryQueryKey(args[1].siteId) });
      await onSuccess?.(...args);
    },
  });
}
