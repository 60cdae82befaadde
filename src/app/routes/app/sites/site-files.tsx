import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { getSiteFilesQueryOptions } from '@/features/files/api/get-site-files';
import { FilesPanel } from '@/features/files/components/files-panel';
import { useRoleInView } from '@/lib/roles';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getSiteFilesQueryOptions(siteIdFrom(params)));
    return null;
  };
}

/** The site workspace's Files section: photos and documents kept with the record. */
export function Component() {
  const siteId = useSiteIdParam();
  const role = useRoleInView() === 'office' ? 'office' : 'engineer';
  return <FilesPanel siteId={siteId} viewer={{ role }} />;
}
