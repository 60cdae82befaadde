import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { useSite } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
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
      {/* Cautions first in reading order: they are for before the ladder and the drill. */}
      <div className="mb-6 grid gap-6 lg:grid-cols-2">
        <InstallationSafetyCard />
        <SitingReminderCard />
      </div>
      <section aria-labelledby="zones-heading" className="grid gap-6">
        <div>
          <h2 id="zones-heading" className="text-xl font-semibold">
            Zone schedule
          </h2>
          <p className="max-w-prose text-sm text-ink-muted">
            Every zone as fitted, in schedule order. Resistor values are in ohms; resistor code
            works too (2k2 for 2200). Nothing is kept until you save the schedule.
          </p>
        </div>
        <ZoneScheduleEditor
          siteId={siteId}
          noSystemNotice={
            <Notice tone="info" title="Record the control panel on the System tab first">
              <p>
                Zones belong to a system and its areas.{' '}
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
