import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { getHomeZonesQueryOptions, useHomeZones } from '@/features/my-homes/api/get-home-zones';
import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { HomeZonesList } from '@/features/my-homes/components/home-zones-list';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getHomeZonesQueryOptions(siteIdFrom(params)));
    return null;
  };
}

export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);
  const { data: schedule } = useHomeZones(siteId);
  return (
    <>
      <title>{`Zones · ${home.name} · Wardbook`}</title>
      <HomeZonesList schedule={schedule} />
    </>
  );
}
