import type { ReactNode } from 'react';
import { ChevronLeft, ShieldAlert } from 'lucide-react';
import { Link } from 'react-router-dom';

import type { SiteDetail } from '@server/sites/schema';
import { paths, type SiteRole } from '@/config/paths';
import { UrnStatusBadge } from '@/features/sites/components/urn-status-badge';
import { PREMISES_TYPE_LABELS } from '@/features/sites/utils/labels';
import { romanClass } from '@/lib/en50131';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs font-medium text-ink-muted">{term}</dt>
      <dd className="font-medium">{children}</dd>
    </div>
  );
}

/**
 * Hazards are advice for whoever attends, not the state of a system, so they carry the ink
 * caution style rather than an alarm or fault colour.
 */
function HazardsCallout({ hazards }: { hazards: string }) {
  return (
    <section
      aria-labelledby="site-hazards-heading"
      className="flex gap-3 rounded-md border border-ink border-l-8 bg-white p-4"
    >
      <ShieldAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-ink" />
      <div className="min-w-0">
        <h2 id="site-hazards-heading" className="font-semibold">
          Hazards on this site
        </h2>
        <p className="mt-1 text-sm whitespace-pre-line">{hazards}</p>
      </div>
    </section>
  );
}

export function SiteHeader({ role, site }: { role: SiteRole; site: SiteDetail }) {
  const address = [site.addressLine1, site.addressLine2, site.town, site.postcode]
    .filter(Boolean)
    .join(', ');

  return (
    <header className="mb-6 grid gap-4">
      <Link
        to={paths.sites.list.getHref(role)}
        className="inline-flex min-h-6 w-fit items-center gap-1 text-sm font-medium text-ink-muted hover:text-ink"
      >
        <ChevronLeft aria-hidden="true" className="size-4" />
        All sites
      </Link>
      <div className="flex flex-wrap items-start justify-between gap-x-8 gap-y-4">
        <div className="min-w-0">
          <p className="font-mono text-sm text-ink-muted">
            <span className="sr-only">Reference </span>
            {site.reference}
          </p>
          <h1 tabIndex={-1} className="text-2xl font-semibold tracking-tight md:text-3xl">
            {site.name}
          </h1>
          <p className="mt-1 text-ink-muted">{address}</p>
        </div>
        <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:flex sm:flex-wrap">
          <Fact term="Premises">{PREMISES_TYPE_LABELS[site.premisesType]}</Fact>
          <Fact term="Grade">
            <span className="font-mono">{site.requiredGrade}</span>
          </Fact>
          <Fact term="Environmental class">
            <span className="font-mono">{romanClass(site.environmentalClass)}</span>
          </Fact>
          <Fact term="Police response">
            <UrnStatusBadge status={site.urnStatus} />
          </Fact>
          <Fact term="Monitoring">
            {site.monitoringCentre ? (
              <>
                {site.monitoringCentre.name}
                {site.monitoringAccount ? (
                  <>
                    {' '}
                    <span className="sr-only">account</span>
                    <span className="font-mono">{site.monitoringAccount}</span>
                  </>
                ) : null}
              </>
            ) : (
              'Not monitored'
            )}
          </Fact>
        </dl>
      </div>
      {site.hazards.trim() ? <HazardsCallout hazards={site.hazards} /> : null}
    </header>
  );
}
