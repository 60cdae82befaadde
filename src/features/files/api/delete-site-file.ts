import { useMutation, useQueryClient } from '@tanstack/react-query';

import { getSiteFilesQueryKey, siteFilesUrl } from '@/features/files/api/get-site-files';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type DeleteSiteFileVariables = { siteId: string; fileId: string };

export function deleteSiteFile({ siteId, fileId }: DeleteSiteFileVariables) {
  return api.delete(`${siteFilesUrl(siteId)}/${encodeURIComponent(fileId)}`);
}

export function useDeleteSiteFile({
  mutationConfig,
}: { mutationConfig?: MutationConfig<undefined, DeleteSiteFileVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: deleteSiteFile,
    onSuccess: async (...args) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: getSiteFilesQueryKey(args[1].siteId) }),
        queryClient.invalidateQueries({ queryKey: ['my', 'homes'] }),
      ]);
      await onSuccess?.(...args);
    },
  });
}
