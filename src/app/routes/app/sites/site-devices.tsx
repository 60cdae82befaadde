import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { SectionAfterCautions } from '@/components/layouts/section-after-cautions';
import { getDevicesQueryOptions } from '@/features/devices/api/get-devices';
import { DeviceListEditor } from '@/features/devices/components/device-list-editor';
import { useSite } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
import { getSystemQueryOptions, useSystem } from '@/features/systems/api/get-system';
import { PanelSafetyCard } from '@/features/systems/components/panel-safety-card';
import { RecordSystemFirstNotice } from '@/features/systems/components/record-system-first-notice';
import { InstallationSafetyCard } from '@/features/zones/components/installation-safety-card';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const siteId = params.siteId ?? '';
    await Promise.all([
      queryClient.ensureQueryData(getDevicesQueryOptions(siteId)),
      // Devices are placed in the system's areas.
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

  return (
    <>
      <title>{`Devices · ${site.name} · Wardbook`}</title>
      <SectionAfterCautions
        cautions={
          <>
            <InstallationSafetyCard />
            <PanelSafetyCard />
          </>
        }
        headingId="devices-heading"
        title="Devices"
        description="Keypads, sounders, zone expanders, communicators and remote power supplies as fitted, with the currents they draw for the power budget. Nothing is kept until you save."
      >
        <DeviceListEditor
          siteId={siteId}
          areas={system?.areas ?? []}
          noSystemNotice={<RecordSystemFirstNotice role={role} siteId={siteId} records="Devices" />}
        />
      </SectionAfterCautions>
    </>
  );
}
