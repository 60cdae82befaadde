import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import { useMyHome } from '@/features/my-homes/api/get-my-home';
import {
  getServiceHistoryQueryOptions,
  useServiceHistory,
} from '@/features/my-homes/api/get-service-history';
import { FaultSafetyCard } from '@/features/my-homes/components/fault-safety-card';
import { ReportFaultForm } from '@/features/my-homes/components/report-fault-form';
import { ServiceHistoryTimeline } from '@/features/my-homes/components/service-history-timeline';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getServiceHistoryQueryOptions(siteIdFrom(params)));
    return null;
  };
}

/** The home's service history, and reporting a fault to the alarm company. */
export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);
  const { data: history } = useServiceHistory(siteId);
  return (
    <>
      <title>{`Service history · ${home.name} · Wardbook`}</title>
      <div className="grid gap-5">
        <div>
          <h2 className="text-xl font-semibold">Service history</h2>
          <p className="text-ink-muted">
            Your alarm company&rsquo;s visits and what they found, the faults you have reported, and
            your handover packs.
          </p>
        </div>
        <ServiceHistoryTimeline entries={history.entries} />
        <FaultSafetyCard />
        <ReportFaultForm siteId={siteId} />
      </div>
    </>
  );
}
