import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { getKeyholdersQueryOptions } from '@/features/keyholders/api/get-keyholders';
import { KeyholdersPanel } from '@/features/keyholders/components/keyholders-panel';
import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getKeyholdersQueryOptions(siteIdFrom(params)));
    return null;
  };
}

export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);
  return (
    <>
      <title>{`Keyholders · ${home.name} · Wardbook`}</title>
      <KeyholdersPanel siteId={siteId} viewer="homeowner" />
    </>
  );
}
