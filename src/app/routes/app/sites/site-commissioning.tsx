import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import type { SystemRecord } from '@server/systems/schema';
import {
  getCommissioningQueryOptions,
  useCommissioning,
} from '@/features/commissioning/api/get-commissioning';
import {
  CommissioningWorkspace,
  type ZoneLoop,
} from '@/features/commissioning/components/commissioning-workspace';
import {
  getSiteEngineeringQueryOptions,
  useSiteEngineering,
} from '@/features/engineering/api/get-site-engineering';
import { useMe } from '@/features/auth/api/get-me';
import { useRenewSession } from '@/features/auth/utils/use-renew-session';
import { useSite } from '@/features/sites/api/get-site';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
import { getSystemQueryOptions, useSystem } from '@/features/systems/api/get-system';
import { RecordSystemFirstNotice } from '@/features/systems/components/record-system-first-notice';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const siteId = params.siteId ?? '';
    // Everything the page needs is fetched up front, so it keeps working if the signal drops.
    await Promise.all([
      queryClient.ensureQueryData(getCommissioningQueryOptions(siteId)),
      queryClient.ensureQueryData(getSiteEngineeringQueryOptions(siteId)),
      queryClient.ensureQueryData(getSystemQueryOptions(siteId)),
    ]);
    return null;
  };
}

const BEARER_NAMES: Record<SystemRecord['signallingPaths'][number]['bearer'], string> = {
  ip: 'IP',
  cellular: 'cellular',
  pstn: 'telephone line',
  radio: 'radio',
};

function signallingPathChoices(system: SystemRecord | null) {
  return (system?.signallingPaths ?? []).map((path) => ({
    position: path.position,
    description: [
      `Path ${path.position}${path.position === 1 ? ' (primary)' : ''}: ${BEARER_NAMES[path.bearer]}`,
      path.atsCategory,
      path.description,
    ]
      .filter(Boolean)
      .join(', '),
  }));
}

export function Component() {
  const role = useSiteRole();
  const { siteId = '' } = useParams();
  const { data: site } = useSite(siteId);
  const { data: commissioning } = useCommissioning(siteId);
  const { data: engineering } = useSiteEngineering(siteId);
  const { data: system } = useSystem(siteId);
  const { data: me } = useMe();
  const userId = me?.user.id ?? 'signed-out';
  const renewSession = useRenewSession(me?.user.id);

  const zoneLoops = new Map<string, ZoneLoop>(
    (engineering?.zones ?? []).map((zone) => [
      zone.zoneId,
      { design: zone.design, bands: zone.bands, problems: zone.problems },
    ]),
  );

  return (
    <>
      <title>{`Commissioning · ${site.name} · Wardbook`}</title>
      <CommissioningWorkspace
        siteId={siteId}
        userId={userId}
        renewSession={renewSession}
        commissioning={commissioning}
        zoneLoops={zoneLoops}
        signallingPaths={signallingPathChoices(system)}
        monitored={site.monitoringCentre !== null}
        noZonesNotice={
          system === null ? (
            <RecordSystemFirstNotice role={role} siteId={siteId} records="Zones" />
          ) : (
            <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
              No zones are on the schedule yet. Add them on the Zones tab, then walk-test them here.
            </p>
          )
        }
      />
    </>
  );
}
