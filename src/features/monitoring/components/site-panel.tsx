import { Building2, DoorOpen, History, ListOrdered, Shield, TriangleAlert } from 'lucide-react';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';

import { Card } from '@/components/ui/card';
import { FalseAlarmStanding } from '@/components/ui/false-alarm-standing';
import { TelLink } from '@/components/ui/tel-link';
import { paths } from '@/config/paths';
import type { AlarmEventDetail } from '@/features/monitoring/api/get-alarm-event';
import { categoryLabel, outcomeLabel } from '@/utils/alarm-words';
import { formatDateTime } from '@/utils/format';

// The URN's state as the operator needs it when deciding whether to call the police.
const URN_WORDS: Record<string, string> = {
  none: 'No police response on this site',
  applied: 'URN applied for, not issued: keyholders only',
  active: 'Police response active',
  warning: 'Police response active, under a false-alarm warning',
  withdrawn: 'Police response withdrawn: keyholders only',
};

function SiteSection({
  title,
  icon: Icon,
  children,
}: {
  title: string;
  icon: typeof Building2;
  children: ReactNode;
}) {
  return (
    <section className="grid gap-1.5 border-t border-hairline pt-3 first:border-t-0 first:pt-0">
      <h3 className="flex items-center gap-2 text-sm font-semibold">
        <Icon aria-hidden="true" className="size-4 shrink-0" />
        {title}
      </h3>
      {children}
    </section>
  );
}

/** Everything about the site an operator needs beside an event, in the order they need it. */
export function SitePanel({ detail }: { detail: AlarmEventDetail }) {
  const { site, callPlan, recentEvents, falseAlarms } = detail;
  if (!site) {
    return (
      <Card title="Site" icon={Building2}>
        <p className="text-sm">
          No site in Wardbook has account{' '}
          <span className="font-mono font-semibold">{detail.event.account}</span>. Check the account
          number with the installer before calling anyone.
        </p>
      </Card>
    );
  }
  return (
    <Card title={site.name} icon={Building2}>
      <div className="grid gap-3 text-sm">
        <SiteSection title="Address" icon={Building2}>
          <address className="not-italic">
            {site.address.map((line, index) => (
              <span key={`${index}-${line}`} className="block">
                {line}
              </span>
            ))}
          </address>
          <p className="font-mono text-xs text-ink-muted">
            {site.reference} · account {detail.event.account}
          </p>
        </SiteSection>

        {site.hazards.trim() ? (
          <section className="rounded-md border-2 border-ink bg-paper p-3">
            <h3 className="flex items-center gap-2 font-semibold">
              <TriangleAlert aria-hidden="true" className="size-5 shrink-0" />
              Hazards at this site
            </h3>
            <p className="mt-1 whitespace-pre-wrap">{site.hazards}</p>
          </section>
        ) : null}

        <SiteSection title="Access notes" icon={DoorOpen}>
          <p className="whitespace-pre-wrap">
            {site.accessNotes.trim() || 'No access notes recorded.'}
          </p>
        </SiteSection>

        <SiteSection title="Call plan" icon={ListOrdered}>
          {callPlan.length === 0 ? (
            <p>No keyholders are recorded for this site.</p>
          ) : (
            <ol aria-label="Call plan" className="grid gap-2">
              {callPlan.map((keyholder) => (
                <li key={keyholder.position} className="flex flex-wrap items-baseline gap-x-2">
                  <span className="font-mono font-semibold">{keyholder.position}.</span>
                  <span className="font-medium">{keyholder.name}</span>
                  <TelLink phone={keyholder.phone} accessiblePrefix={`Call ${keyholder.name} on`} />
                  <span className="text-ink-muted">
                    can attend in <span className="font-mono">{keyholder.minutesToAttend}</span> min
                  </span>
                </li>
              ))}
            </ol>
          )}
        </SiteSection>

        <SiteSection title="Police response" icon={Shield}>
          <p>
            <span className="font-semibold">{URN_WORDS[site.urnStatus] ?? site.urnStatus}</span>
            {site.policeUrn ? (
              <>
                {' '}
                · URN <span className="font-mono font-semibold">{site.policeUrn}</span>
              </>
            ) : null}
          </p>
          {site.confirmationWindowMinutes ? (
            <p className="text-ink-muted">
              Confirmation window:{' '}
              <span className="font-mono">{site.confirmationWindowMinutes}</span> minutes (a second
              detector within it confirms an intruder alarm, BS 8243).
            </p>
          ) : null}
          {falseAlarms ? <FalseAlarmStanding falseAlarms={falseAlarms} /> : null}
        </SiteSection>

        <SiteSection title="Recent events here" icon={History}>
          {recentEvents.length === 0 ? (
            <p>No earlier events from this site.</p>
          ) : (
            <ul className="grid gap-1">
              {recentEvents.map((recent) => (
                <li key={recent.id}>
                  <Link to={paths.monitoringEvent.getHref(recent.id)}>
                    {categoryLabel(recent.category)}
                  </Link>{' '}
                  <time dateTime={recent.at} className="text-ink-muted">
                    {formatDateTime(recent.at)}
                  </time>
                  <span className="block text-xs text-ink-muted">
                    {recent.outcome ? outcomeLabel(recent.outcome) : 'Still open'}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </SiteSection>
      </div>
    </Card>
  );
}
