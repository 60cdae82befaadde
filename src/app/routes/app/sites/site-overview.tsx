import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { UserCog } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { buttonClassName } from '@/components/ui/button-styles';
import { paths } from '@/config/paths';
import { ServicePlanCard } from '@/features/service/components/service-plan-card';
import { getSiteQueryOptions, useSite } from '@/features/sites/api/get-site';
import { EditSiteForm } from '@/features/sites/components/edit-site-form';
import { EngineerAssignment } from '@/features/sites/components/engineer-assignment';
import { SiteFalseAlarms } from '@/features/sites/components/site-false-alarms';
import { SiteHomeowners } from '@/features/sites/components/site-homeowners';
import { useSiteRole } from '@/features/sites/utils/use-site-role';
import { formatDateTime } from '@/utils/format';

export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getSiteQueryOptions(params.siteId ?? ''));
    return null;
  };
}

export function Component() {
  const role = useSiteRole();
  const { siteId = '' } = useParams();
  const { data: site } = useSite(siteId);

  return (
    <>
      <title>{`${site.name} · Wardbook`}</title>
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <section aria-labelledby="site-details-heading" className="min-w-0">
          <div className="mb-4">
            <h2 id="site-details-heading" className="text-xl font-semibold">
              Site details
            </h2>
            <p className="text-sm text-ink-muted">
              Created {formatDateTime(site.createdAt)}; last changed{' '}
              {formatDateTime(site.updatedAt)}.
            </p>
          </div>
          <EditSiteForm siteId={site.id} />
        </section>
        <aside aria-label="People on this site" className="grid min-w-0 content-start gap-6">
          {role === 'office' ? (
            <EngineerAssignment site={site} />
          ) : (
            <Card title="Assigned engineers" icon={UserCog}>
              {site.engineers.length === 0 ? (
                <p className="text-sm text-ink-muted">No engineer is assigned yet.</p>
              ) : (
                <ul className="grid gap-1">
                  {site.engineers.map((engineer) => (
                    <li key={engineer.id}>{engineer.displayName}</li>
                  ))}
                </ul>
              )}
            </Card>
          )}
          <ServicePlanCard
            siteId={site.id}
            audience="staff"
            actions={
              <Link
                to={paths.service.getHref(role, role === 'office' ? { book: site.id } : {})}
                className={buttonClassName({ variant: 'secondary' })}
              >
                {role === 'office' ? 'Book a visit' : 'Service schedule'}
              </Link>
            }
          />
          <SiteHomeowners site={site} canManage={role === 'office'} />
          {site.monitoringCentre ? <SiteFalseAlarms siteId={site.id} /> : null}
        </aside>
      </div>
    </>
  );
}
