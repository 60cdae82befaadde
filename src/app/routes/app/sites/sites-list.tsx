import type { QueryClient } from '@tanstack/react-query';
import { Building2, Plus, RotateCw } from 'lucide-react';
import { Link, useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';

import { describeError } from '@/components/errors/describe-error';
import { Button } from '@/components/ui/button';
import { buttonClassName } from '@/components/ui/button-styles';
import { LoadingStatus } from '@/components/ui/loading-status';
import { Notice } from '@/components/ui/notice';
import { PageHeading } from '@/components/ui/page-heading';
import { Pagination } from '@/components/ui/pagination';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useEngineerChoices } from '@/features/sites/api/get-engineer-choices';
import { getSitesQueryOptions, useSites } from '@/features/sites/api/get-sites';
import { SiteListFilterBar } from '@/features/sites/components/site-list-filters';
import { SitesTable } from '@/features/sites/components/sites-table';
import {
  readSiteListFilters,
  siteListSearchParams,
  type SiteListFilters,
} from '@/features/sites/utils/list-filters';
import { useSiteRole } from '@/features/sites/utils/use-site-role';

export function createLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const filters = readSiteListFilters(new URL(request.url).searchParams);
    // Prefetch rather than ensure: a failed list is shown on the page, beside its filters.
    await queryClient.prefetchQuery(getSitesQueryOptions(filters));
    return null;
  };
}

export function Component() {
  const role = useSiteRole();
  const { data: me } = useMe();
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = readSiteListFilters(searchParams);
  const sites = useSites(filters);
  const installerId = me?.roles.find((grant) => grant.role === role)?.organisation?.id;
  const engineers = useEngineerChoices(role, installerId);

  const changeFilters = (change: Partial<SiteListFilters>, options: { replace?: boolean } = {}) => {
    // Any change but turning the page starts again from page 1.
    const page = 'page' in change ? (change.page ?? 1) : 1;
    setSearchParams(siteListSearchParams({ ...filters, ...change, page }), options);
  };

  const hasFilters = Boolean(
    filters.q || filters.grade || filters.urnStatus || filters.monitored || filters.engineerId,
  );

  return (
    <>
      <title>Sites · Wardbook</title>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <PageHeading title="Sites">
          <p>Every site your company maintains: its grade, police response and monitoring.</p>
        </PageHeading>
        <Link to={paths.sites.create.getHref(role)} className={buttonClassName()}>
          <Plus aria-hidden="true" className="size-4" />
          New site
        </Link>
      </div>

      <section
        aria-label="Site list"
        className="overflow-hidden rounded-lg border border-hairline bg-white"
      >
        <SiteListFilterBar
          filters={filters}
          engineers={engineers.data ?? []}
          currentUserId={me?.user.id}
          onChange={(change) => changeFilters(change, { replace: 'q' in change })}
        />
        <div className="border-t border-hairline">
          {sites.isPending ? (
            <LoadingStatus label="Loading sites" className="px-4 py-6 md:px-5" />
          ) : sites.isError ? (
            <div className="p-4 md:p-5">
              <Notice tone="fault" title="The site list could not be loaded">
                <p>{describeError(sites.error).message}</p>
                <Button variant="secondary" className="mt-3" onClick={() => void sites.refetch()}>
                  <RotateCw aria-hidden="true" className="size-4" />
                  Try again
                </Button>
              </Notice>
            </div>
          ) : sites.data.items.length === 0 ? (
            <div className="flex flex-col items-start gap-3 px-4 py-8 md:px-5">
              <Building2 aria-hidden="true" className="size-8 text-ink-muted" />
              {hasFilters ? (
                <p>No sites match these filters. Clear the filters or search for something else.</p>
              ) : (
                <p>
                  No sites are recorded yet. Use <span className="font-semibold">New site</span> to
                  add the first one you have surveyed.
                </p>
              )}
            </div>
          ) : (
            <>
              <SitesTable
                role={role}
                sites={sites.data.items}
                filters={filters}
                isRefreshing={sites.isPlaceholderData}
                onSortChange={(sort, order) => changeFilters({ sort, order })}
              />
              <div className="border-t border-hairline">
                <Pagination
                  itemsName="sites"
                  page={sites.data.page}
                  pageSize={sites.data.pageSize}
                  total={sites.data.total}
                  onPageChange={(page) => changeFilters({ page })}
                  onPageSizeChange={(pageSize) => changeFilters({ pageSize })}
                />
              </div>
            </>
          )}
        </div>
      </section>
    </>
  );
}
