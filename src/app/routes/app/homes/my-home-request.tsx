import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { getChangeRequestsQueryOptions } from '@/features/change-requests/api/get-change-requests';
import { ChangeRequestForm } from '@/features/change-requests/components/change-request-form';
import { ChangeRequestList } from '@/features/change-requests/components/change-request-list';
import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getChangeRequestsQueryOptions(siteIdFrom(params)));
    return null;
  };
}

export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);
  return (
    <>
      <title>{`Request a change · ${home.name} · Wardbook`}</title>
      <div className="grid gap-6">
        <ChangeRequestForm siteId={siteId} />
        <ChangeRequestList siteId={siteId} viewer="homeowner" />
      </div>
    </>
  );
}
