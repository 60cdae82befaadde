import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { getDevicesQueryOptions, useDevices } from '@/features/devices/api/get-devices';
import {
  getSiteEngineeringQueryOptions,
  useSiteEngineering,
} from '@/features/engineering/api/get-site-engineering';
import { SystemEngineering } from '@/features/engineering/components/system-engineering';
import { powerItemsOf } from '@/features/engineering/utils/power-items';
import { useSite } from '@/features/sites/api/get-site';
import { getSystemQueryOptions, useSystem } from '@/features/systems/api/get-system';
import { PanelSafetyCard } from '@/features/systems/components/panel-safety-card';
import { SystemForm } from '@/features/systems/components/system-form';
import { getZonesQueryOptions, useZones } from '@/features/zones/api/get-zones';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const siteId = params.siteId ?? '';
    // Zones and devices are read for the list of items the power budget sums.
    await Promise.all([
      queryClient.ensureQueryData(getSystemQueryOptions(siteId)),
      queryClient.ensureQueryData(getSiteEngineeringQueryOptions(siteId)),
      queryClient.ensureQueryData(getZonesQueryOptions(siteId)),
      queryClient.ensureQueryData(getDevicesQueryOptions(siteId)),
    ]);
    return null;
  };
}

function EngineeringChecks({ siteId }: { siteId: string }) {
  const { data: system } = useSystem(siteId);
  const { data: engineering } = useSiteEngineering(siteId);
  const { data: schedule } = useZones(siteId);
  const { data: deviceList } = useDevices(siteId);
  const powerItems = system ? powerItemsOf(system, schedule.zones, deviceList.devices) : undefined;
  return <SystemEngineering engineering={engineering} powerItems={powerItems} />;
}

export function Component() {
  const { siteId = '' } = useParams();
  const { data: site } = useSite(siteId);

  return (
    <>
      <title>{`System · ${site.name} · Wardbook`}</title>
      {/* The caution comes first in reading order: it is for before the panel is opened. */}
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <aside aria-label="Safety" className="min-w-0 xl:col-start-2 xl:row-start-1">
          <PanelSafetyCard />
        </aside>
        <div className="grid min-w-0 gap-10 xl:col-start-1 xl:row-start-1">
          <section aria-labelledby="system-heading" className="min-w-0">
            <div className="mb-4">
              <h2 id="system-heading" className="text-xl font-semibold">
                System
              </h2>
              <p className="text-sm text-ink-muted">
                The control panel, its power supply, how it signals and the areas it is divided
                into.
              </p>
            </div>
            <SystemForm siteId={siteId} />
          </section>
          <section aria-labelledby="system-checks-heading" className="min-w-0">
            <div className="mb-4">
              <h2 id="system-checks-heading" className="text-xl font-semibold">
                Checks on the saved system
              </h2>
              <p className="text-sm text-ink-muted">
                Worked out from the system, zones and devices as last saved, against the
                site&rsquo;s required grade {site.requiredGrade}.
              </p>
            </div>
            <EngineeringChecks siteId={siteId} />
          </section>
        </div>
      </div>
    </>
  );
}
