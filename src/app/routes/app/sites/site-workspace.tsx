import { Suspense } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Outlet, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { LoadingStatus } from '@/components/ui/loading-status';
import { getSiteQueryOptions, useSite } from '@/features/sites/api/get-site';
import { SiteHeader } from '@/features/sites/components/site-header';
import { SiteSectionTabs } from '@/features/sites/components/site-section-tabs';
import { useSiteRole } from '@/features/sites/utils/use-site-role';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getSiteQueryOptions(params.siteId ?? ''));
    return null;
  };
}

/** One site's record: its header and hazards, the section tabs, and the open section. */
export function Component() {
  const role = useSiteRole();
  const { siteId = '' } = useParams();
  const { data: site } = useSite(siteId);

  return (
    <>
      <SiteHeader role={role} site={site} />
      <SiteSectionTabs role={role} site={site} />
      <div className="mt-6">
        <Suspense fallback={<LoadingStatus label="Loading section" />}>
          <Outlet />
        </Suspense>
      </div>
    </>
  );
}
