import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { SectionAfterCautions } from '@/components/layouts/section-after-cautions';
import { useSite } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
import { RecordSystemFirstNotice } from '@/features/systems/components/record-system-first-notice';
import { getZonesQueryOptions } from '@/features/zones/api/get-zones';
import { InstallationSafetyCard } from '@/features/zones/components/installation-safety-card';
import { SitingReminderCard } from '@/features/zones/components/siting-reminder-card';
import { ZoneScheduleEditor } from '@/features/zones/components/zone-schedule-editor';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getZonesQueryOptions(params.siteId ?? ''));
    return null;
  };
}

export function Component() {
  const role = useSiteRole();
  const { siteId = '' } = useParams();
  const { data: site } = useSite(siteId);

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
        description="Every zone as fitted, in schedule order. Resistor values are in ohms; resistor code works too (2k2 for 2200). Nothing is kept until you save the schedule."
      >
        <ZoneScheduleEditor
          siteId={siteId}
          noSystemNotice={<RecordSystemFirstNotice role={role} siteId={siteId} records="Zones" />}
        />
      </SectionAfterCautions>
    </>
  );
}
