import type { QueryClient } from '@tanstack/react-query';
import { ChevronLeft } from 'lucide-react';
import { Suspense } from 'react';
import { Link, Outlet, type LoaderFunctionArgs } from 'react-router-dom';

import { LoadingStatus } from '@/components/ui/loading-status';
import { PageHeading } from '@/components/ui/page-heading';
import { PostalAddress } from '@/components/ui/postal-address';
import { paths } from '@/config/paths';
import { getMyHomeQueryOptions, useMyHome } from '@/features/my-homes/api/get-my-home';
import { HomeSectionNav } from '@/features/my-homes/components/home-section-nav';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getMyHomeQueryOptions(siteIdFrom(params)));
    return null;
  };
}

/** A homeowner's own site: its name and address, the section links, and the open section. */
export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);

  return (
    <>
      <Link
        to={paths.home.homeowner.getHref()}
        className="-ml-1 mb-3 inline-flex min-h-11 items-center gap-1 px-1 font-medium"
      >
        <ChevronLeft aria-hidden="true" className="size-5" />
        All my homes
      </Link>
      <PageHeading title={home.name}>
        <PostalAddress address={home.address} />
      </PageHeading>
      <HomeSectionNav siteId={siteId} homeName={home.name} />
      <div className="mt-6">
        <Suspense fallback={<LoadingStatus label="Loading" />}>
          <Outlet />
        </Suspense>
      </div>
    </>
  );
}
