import { siteFileSchema, type SiteFile } from '@server/files/schema';
import { useMutation, useQueryClient } from '@tanstack/react-query';

import { getSiteFilesQueryKey, siteFilesUrl } from '@/features/files/api/get-site-files';
import { apiUpload, type UploadProgress } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type UploadSiteFileVariables = {
  siteId: string;
  file: File;
  description: string;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
};

/**
 * Sends one photo or document. The API decides its type from the bytes and refuses anything that
 * is not JPEG, PNG, WebP or PDF (415) or is too large (413).
 */
export function uploadSiteFile({
  siteId,
  file,
  description,
  onProgress,
  signal,
}: UploadSiteFileVariables) {
  const body = new FormData();
  // The description goes first so the server has it before the file's bytes stream in.
  body.append('description', description);
  body.append('file', file, file.name);
  return apiUpload(siteFilesUrl(siteId), { body, schema: siteFileSchema, onProgress, signal });
}

export function useUploadSiteFile({
  mutationConfig,
}: { mutationConfig?: MutationConfig<SiteFile, UploadSiteFileVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, ...restConfig } = mutationConfig ?? {};
  return useMutation({
    ...restConfig,
    mutationFn: uploadSiteFile,
    onSuccess: async (...args) => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: getSiteFilesQueryKey(args[1].siteId) }),
        queryClient.invalidateQueries({ queryKey: ['my', 'homes'] }),
      ]);
      await onSuccess?.(...args);
    },
  });
}
