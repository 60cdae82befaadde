import type { QueryClient } from '@tanstack/react-query';
import type { LoaderFunctionArgs } from 'react-router-dom';

import {
  getHomeSignalsQueryOptions,
  useHomeSignals,
} from '@/features/my-homes/api/get-home-signals';
import { useMyHome } from '@/features/my-homes/api/get-my-home';
import { PoliceResponse } from '@/features/my-homes/components/police-response';
import { SignalHistory } from '@/features/my-homes/components/signal-history';
import { siteIdFrom, useSiteIdParam } from '@/lib/site-id-param';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureInfiniteQueryData(getHomeSignalsQueryOptions(siteIdFrom(params)));
    return null;
  };
}

/** The signals a homeowner's system has sent, and what its false alarms mean for the police. */
export function Component() {
  const siteId = useSiteIdParam();
  const { data: home } = useMyHome(siteId);
  const { data: signals } = useHomeSignals(siteId);
  return (
    <>
      <title>{`Signal history · ${home.name} · Wardbook`}</title>
      <div className="grid gap-5">
        <div>
          <h2 className="text-xl font-semibold">Signal history</h2>
          <p className="text-ink-muted">
            What your alarm has sent to the monitoring centre: alarms, restores, setting and
            unsetting, tests and faults. If something here surprises you, ask your alarm company.
          </p>
        </div>
        <PoliceResponse home={home} falseAlarms={signals.pages[0]?.falseAlarms} />
        <SignalHistory siteId={siteId} />
      </div>
    </>
  );
}
