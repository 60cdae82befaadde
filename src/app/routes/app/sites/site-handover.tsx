import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { getHandoverQueryOptions, useHandover } from '@/features/handover/api/get-handover';
import { HandoverWorkspace } from '@/features/handover/components/handover-workspace';
import { useSite } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getHandoverQueryOptions(siteIdFrom(params)));
    return null;
  };
}

/** The site workspace's Handover section: variations, signatures, issue, and issued packs. */
export function Component() {
  const role = useSiteRole();
  const siteId = useSiteIdParam();
  const { data: site } = useSite(siteId);
  const { data: handover } = useHandover(siteId);
  const { data: me } = useMe();
  // Signing as the engineer, the customer's signature in person, and issuing are for the
  // installer's engineers, whichever of their roles they have this page open in.
  const isSiteEngineer =
    me?.roles.some(
      (grant) => grant.role === 'engineer' && grant.organisation?.id === site.installer.id,
    ) ?? false;

  return (
    <>
      <title>{`Handover · ${site.name} · Wardbook`}</title>
      <HandoverWorkspace
        siteId={siteId}
        state={handover}
        signerName={me?.user.displayName ?? ''}
        commissioningHref={`${paths.sites.workspace.getHref(role, siteId, 'commissioning')}#pre-issue-check`}
        canRevoke={role === 'office'}
        isSiteEngineer={isSiteEngineer}
      />
    </>
  );
}
