import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useMemo } from 'react';
import { useSearchParams, type LoaderFunctionArgs } from 'react-router-dom';

import { PageHeading } from '@/components/ui/page-heading';
import { paths } from '@/config/paths';
import { getMeQueryOptions, useMe } from '@/features/auth/api/get-me';
import { getOverdueSitesQueryOptions } from '@/features/service/api/get-overdue-sites';
import { getServiceScheduleQueryOptions } from '@/features/service/api/get-service-schedule';
import { ServiceSchedule } from '@/features/service/components/service-schedule';
import { siteChoiceOf } from '@/features/service/utils/site-choice';
import { readScheduleView, scheduleRangeOf } from '@/features/service/utils/schedule-view';
import { ukToday } from '@/features/service/utils/uk-calendar';
import { useEngineerChoices } from '@/features/sites/api/get-engineer-choices';
import { getSiteQueryOptions } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';

export function createLoader(queryClient: QueryClient) {
  return async ({ request }: LoaderFunctionArgs) => {
    const url = new URL(request.url);
    const isOffice = url.pathname.startsWith(paths.home.office.getHref());
    const me = await queryClient.ensureQueryData(getMeQueryOptions());
    const view = readScheduleView(url.searchParams, ukToday());
    const range = scheduleRangeOf(view, isOffice ? undefined : me?.user.id);
    // Prefetch rather than ensure: a list that fails is shown on the page, with a retry.
    await Promise.all([
      queryClient.prefetchQuery(getServiceScheduleQueryOptions(range)),
      isOffice ? queryClient.prefetchQuery(getOverdueSitesQueryOptions()) : null,
    ]);
    return null;
  };
}

/**
 * The service schedule: the office books, assigns and moves the company's visits and sees what
 * is overdue; an engineer sees the visits they are sent on.
 */
export function Component() {
  const role = useSiteRole();
  const { data: me } = useMe();
  const [searchParams] = useSearchParams();
  const installerId = me?.roles.find((grant) => grant.role === role)?.organisation?.id;
  const engineers = useEngineerChoices(role, role === 'office' ? installerId : undefined);
  // The booking form opened for a site (from its plan or the overdue list) names it.
  const bookSiteId = readScheduleView(searchParams, ukToday()).bookSiteId;
  const bookSite = useQuery({
    ...getSiteQueryOptions(bookSiteId ?? ''),
    enabled: role === 'office' && Boolean(bookSiteId),
  });
  // One object per site, so the form picks the site once rather than on every render.
  const presetSite = useMemo(
    () => (bookSite.data ? siteChoiceOf(bookSite.data) : undefined),
    [bookSite.data],
  );

  return (
    <>
      <title>Service schedule · Wardbook</title>
      <PageHeading title="Service schedule">
        <p>
          {role === 'office'
            ? 'Preventive visits and call-outs by month: book them, send an engineer, move them, and see which sites are overdue.'
            : 'The preventive visits and call-outs you are sent on, by month. The office books and moves them.'}
        </p>
      </PageHeading>
      <ServiceSchedule
        role={role}
        ownEngineerId={role === 'engineer' ? me?.user.id : undefined}
        engineers={engineers.data ?? []}
        engineersError={role === 'office' ? engineers.error : undefined}
        bookSite={presetSite}
      />
    </>
  );
}
