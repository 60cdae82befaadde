import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { getUserSlotsQueryOptions } from '@/features/user-slots/api/get-user-slots';
import { UserSlotsPanel } from '@/features/user-slots/components/user-slots-panel';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getUserSlotsQueryOptions(siteIdFrom(params)));
    return null;
  };
}

export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);
  return (
    <>
      <title>{`User codes · ${home.name} · Wardbook`}</title>
      <UserSlotsPanel siteId={siteId} viewer="homeowner" />
    </>
  );
}
