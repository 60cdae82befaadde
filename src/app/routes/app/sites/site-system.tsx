import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs } from 'react-router-dom';

import { useSite } from '@/features/sites/api/get-site';
import { getSystemQueryOptions } from '@/features/systems/api/get-system';
import { PanelSafetyCard } from '@/features/systems/components/panel-safety-card';
import { SystemForm } from '@/features/systems/components/system-form';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getSystemQueryOptions(params.siteId ?? ''));
    return null;
  };
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
        <section aria-labelledby="system-heading" className="min-w-0 xl:col-start-1 xl:row-start-1">
          <div className="mb-4">
            <h2 id="system-heading" className="text-xl font-semibold">
              System
            </h2>
            <p className="text-sm text-ink-muted">
              The control panel, its power supply, how it signals and the areas it is divided into.
            </p>
          </div>
          <SystemForm siteId={siteId} />
        </section>
      </div>
    </>
  );
}
