import { siteFileListSchema } from '@server/files/schema';
import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';

import { api } from '@/lib/api-client';
import { siteQueryKeys } from '@/lib/site-query-keys';

export const siteFilesUrl = (siteId: string) => `/api/sites/${encodeURIComponent(siteId)}/files`;

/** Where a file's bytes are streamed from; `inline` asks for an image to be shown, not saved. */
export const siteFileContentUrl = (siteId: string, fileId: string, { inline = false } = {}) =>
  `${siteFilesUrl(siteId)}/${encodeURIComponent(fileId)}/content${inline ? '?inline=1' : ''}`;

/** Photos and documents kept with the site record, newest first. */
export async function getSiteFiles(siteId: string, { signal }: { signal?: AbortSignal } = {}) {
  const { files } = await api.get(siteFilesUrl(siteId), siteFileListSchema, { signal });
  return files;
}

export const getSiteFilesQueryKey = (siteId: string) => siteQueryKeys.section(siteId, 'files');

export const getSiteFilesQueryOptions = (siteId: string) =>
  queryOptions({
    queryKey: getSiteFilesQueryKey(siteId),
    queryFn: ({ signal }) => getSiteFiles(siteId, { signal }),
  });

export const useSiteFiles = (siteId: string) => useSuspenseQuery(getSiteFilesQueryOptions(siteId));
