import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { SectionAfterCautions } from '@/components/layouts/section-after-cautions';
import { useSite } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
import { getSystemQueryOptions, useSystem } from '@/features/systems/api/get-system';
import { RecordSystemFirstNotice } from '@/features/systems/components/record-system-first-notice';
import { getZonesQueryOptions } from '@/features/zones/api/get-zones';
import { InstallationSafetyCard } from '@/features/zones/components/installation-safety-card';
import { SitingReminderCard } from '@/features/zones/components/siting-reminder-card';
import { ZoneScheduleEditor } from '@/features/zones/components/zone-schedule-editor';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const siteId = params.siteId ?? '';
    // The system's resistor tolerance and cable core set every zone's expected readings.
    await Promise.all([
      queryClient.ensureQueryData(getZonesQueryOptions(siteId)),
      queryClient.ensureQueryData(getSystemQueryOptions(siteId)),
    ]);
    return null;
  };
}

export function Component() {
  const role = useSiteRole();
  const { siteId = '' } = useParams();
  const { data: site } = useSite(siteId);
  const { data: system } = useSystem(siteId);
  const loopSettings = {
    resistorTolerance: system?.resistorTolerance ?? 0.05,
    cableCore: system?.cableCore ?? '7/0.2',
  } as const;

  return (
    <>
      <title>{`Zones · ${site.name} · Wardbook`}</title>
      <SectionAfterCautions
        cautions={
          <>
            <InstallationSafetyCard />
            <SitingReminderCard />
          </>
        }
        headingId="zones-heading"
        title="Zone schedule"
        description="Every zone as fitted, in schedule order. Resistor values are in ohms; resistor code works too (2k2 for 2200). Expected readings allow for the system’s resistor tolerance and each zone’s cable run (set on the System tab and in each row). Nothing is kept until you save the schedule."
      >
        <ZoneScheduleEditor
          siteId={siteId}
          loopSettings={loopSettings}
          noSystemNotice={<RecordSystemFirstNotice role={role} siteId={siteId} records="Zones" />}
        />
      </SectionAfterCautions>
    </>
  );
}
