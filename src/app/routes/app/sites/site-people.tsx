import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { getChangeRequestsQueryOptions } from '@/features/change-requests/api/get-change-requests';
import { ChangeRequestList } from '@/features/change-requests/components/change-request-list';
import { getKeyholdersQueryOptions } from '@/features/keyholders/api/get-keyholders';
import { KeyholdersPanel } from '@/features/keyholders/components/keyholders-panel';
import { getUserSlotsQueryOptions } from '@/features/user-slots/api/get-user-slots';
import { UserSlotsPanel } from '@/features/user-slots/components/user-slots-panel';
import { useRoleInView } from '@/lib/roles';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const siteId = siteIdFrom(params);
    await Promise.all([
      queryClient.ensureQueryData(getKeyholdersQueryOptions(siteId)),
      queryClient.ensureQueryData(getUserSlotsQueryOptions(siteId)),
      queryClient.ensureQueryData(getChangeRequestsQueryOptions(siteId)),
    ]);
    return null;
  };
}

/** The site workspace's People section: call plan, user-code slots and the homeowner's requests. */
export function Component() {
  const siteId = useSiteIdParam();
  const viewer = useRoleInView() === 'office' ? 'office' : 'engineer';
  return (
    <div className="grid gap-8">
      <KeyholdersPanel siteId={siteId} viewer={viewer} />
      <UserSlotsPanel siteId={siteId} viewer={viewer} />
      <ChangeRequestList siteId={siteId} viewer="staff" />
    </div>
  );
}
