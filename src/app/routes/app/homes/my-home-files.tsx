import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { useMe } from '@/features/auth/api/get-me';
import { getSiteFilesQueryOptions } from '@/features/files/api/get-site-files';
import { FilesPanel } from '@/features/files/components/files-panel';
import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getSiteFilesQueryOptions(siteIdFrom(params)));
    return null;
  };
}

export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);
  const { data: me } = useMe();
  return (
    <>
      <title>{`Files · ${home.name} · Wardbook`}</title>
      <FilesPanel
        siteId={siteId}
        viewer={{ role: 'homeowner', displayName: me?.user.displayName ?? '' }}
      />
    </>
  );
}
