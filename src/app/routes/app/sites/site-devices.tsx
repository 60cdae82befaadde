import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { getDevicesQueryOptions } from '@/features/devices/api/get-devices';
import { DeviceListEditor } from '@/features/devices/components/device-list-editor';
import { useSite } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
import { getSystemQueryOptions, useSystem } from '@/features/systems/api/get-system';
import { PanelSafetyCard } from '@/features/systems/components/panel-safety-card';
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
      {/* Cautions first in reading order: they are for before the ladder and the drill. */}
      <div className="mb-6 grid gap-6 lg:grid-cols-2">
        <InstallationSafetyCard />
        <PanelSafetyCard />
      </div>
      <section aria-labelledby="devices-heading" className="grid gap-6">
        <div>
          <h2 id="devices-heading" className="text-xl font-semibold">
            Devices
          </h2>
          <p className="max-w-prose text-sm text-ink-muted">
            Keypads, sounders, zone expanders, communicators and remote power supplies as fitted,
            with the currents they draw for the power budget. Nothing is kept until you save.
          </p>
        </div>
        <DeviceListEditor
          siteId={siteId}
          areas={system?.areas ?? []}
          noSystemNotice={
            <Notice tone="info" title="Record the control panel on the System tab first">
              <p>
                Devices belong to a system and its areas.{' '}
                <Link
                  to={paths.sites.workspace.getHref(role, siteId, 'system')}
                  className="font-semibold text-ink"
                >
                  Go to the System tab
                </Link>
              </p>
            </Notice>
          }
        />
      </section>
    </>
  );
}
