import { useEffect, useRef, useState, type ReactNode } from 'react';
import { useSearchParams } from 'react-router-dom';

import type { LoopDesign } from '@server/calc/loop';
import { EngineerSafetyCard } from '@/components/ui/engineer-safety-card';
import type { Commissioning } from '@/features/commissioning/api/get-commissioning';
import { OutboxNotice } from '@/features/commissioning/components/outbox-notice';
import { PreIssueCheckPanel } from '@/features/commissioning/components/pre-issue-check-panel';
import {
  BatteryTestForm,
  SignallingTestForm,
  SounderTestForm,
  type SignallingPathChoice,
} from '@/features/commissioning/components/system-tests';
import { ZoneWalkItem } from '@/features/commissioning/components/zone-walk-item';
import { statusOf } from '@/features/commissioning/utils/test-status';
import { useOutbox } from '@/features/commissioning/utils/use-outbox';
import { zoneItemId, zonePanelHeadingId } from '@/features/commissioning/utils/zone-ids';
import type { BandLike } from '@/lib/loop-readings';

export type ZoneLoop = { design: LoopDesign; bands: BandLike[]; problems: string[] };

type CommissioningWorkspaceProps = {
  siteId: string;
  /** The signed-in person: what waits on the phone, and drafts, are kept per person. */
  userId: string;
  /** Fetches the signed-in person again (renewing the security token); true when signed in. */
  renewSession: () => Promise<boolean>;
  commissioning: Commissioning;
  /** Each zone's loop design and bands, as the API works them out, by zone id. */
  zoneLoops: ReadonlyMap<string, ZoneLoop>;
  signallingPaths: readonly SignallingPathChoice[];
  monitored: boolean;
  /** Shown instead of the zone list while no zone is recorded. */
  noZonesNotice: ReactNode;
};

const ON_THIS_PAGE = [
  { href: '#walk-tests-heading', label: 'Walk tests' },
  { href: '#system-tests-heading', label: 'System tests' },
  { href: '#pre-issue-check', label: 'Pre-issue check' },
];

/**
 * Commissioning on site, on a phone: cautions first, then each zone's walk test, the system
 * tests and the pre-issue check. Everything saved without a connection waits on the phone.
 */
export function CommissioningWorkspace({
  siteId,
  userId,
  renewSession,
  commissioning,
  zoneLoops,
  signallingPaths,
  monitored,
  noZonesNotice,
}: CommissioningWorkspaceProps) {
  const outbox = useOutbox({ userId, siteId, renewSession });
  const draftScope = `${userId}:${siteId}`;
  const [searchParams] = useSearchParams();
  const [openZoneId, setOpenZoneId] = useState<string | null>(() => searchParams.get('zone'));
  // The zone opened by "Next zone" (or a link), to bring up and start from once it is drawn.
  const zoneToFocus = useRef<string | null>(null);
  const { zones, systemTests, check } = commissioning;

  useEffect(() => {
    const zoneId = zoneToFocus.current;
    if (!zoneId) return;
    zoneToFocus.current = null;
    document.getElementById(zoneItemId(zoneId))?.scrollIntoView({ block: 'start' });
    document.getElementById(zonePanelHeadingId(zoneId))?.focus({ preventScroll: true });
  });

  const openZone = (zoneId: string) => {
    zoneToFocus.current = zoneId;
    setOpenZoneId(zoneId);
  };

  const onPhoneFor = (zoneId: string) => outbox.entries.filter((entry) => entry.zoneId === zoneId);
  const testsOnPhone = (kind: string) =>
    outbox.entries.filter((entry) => entry.kind === 'system-test' && entry.testKind === kind);
  const lastTest = (kind: string) => systemTests.find((test) => test.kind === kind);

  const counts = { passed: 0, failed: 0, waiting: 0, untested: 0 };
  for (const entry of zones) {
    const status = statusOf(
      entry.lastWalkTest,
      onPhoneFor(entry.zone.id).filter((item) => item.kind === 'walk-test'),
    );
    if (status === 'passed') counts.passed += 1;
    else if (status === 'failed' || status === 'refused') counts.failed += 1;
    else if (status === 'on-phone') counts.waiting += 1;
    else counts.untested += 1;
  }

  const context = { draftScope, submit: outbox.submit };

  return (
    <div className="mx-auto grid max-w-3xl gap-8">
      <EngineerSafetyCard />
      <OutboxNotice outbox={outbox} />
      <nav aria-label="On this page">
        <ul className="flex flex-wrap gap-2">
          {ON_THIS_PAGE.map((link) => (
            <li key={link.href}>
              <a
                href={link.href}
                className="inline-flex min-h-11 items-center rounded-md border border-hairline bg-white px-3 text-sm font-semibold no-underline hover:bg-paper-deep"
              >
                {link.label}
              </a>
            </li>
          ))}
        </ul>
      </nav>

      <section aria-labelledby="walk-tests-heading" className="grid gap-4">
        <div>
          <h2 id="walk-tests-heading" className="scroll-mt-4 text-xl font-semibold">
            Walk tests
          </h2>
          <p className="text-sm text-ink-muted">
            Take the secure reading at the panel, walk the detector, and tick that the panel showed
            it. Readings can be typed as 2210, 2k21, 2.21 kΩ or OL.
          </p>
          {zones.length > 0 ? (
            <p className="mt-1 text-sm font-medium">
              {counts.passed} passed · {counts.failed} failed
              {counts.waiting > 0 ? ` · ${counts.waiting} on this phone` : ''} · {counts.untested}{' '}
              not tested, of {zones.length} {zones.length === 1 ? 'zone' : 'zones'}
            </p>
          ) : null}
        </div>
        {zones.length === 0 ? (
          noZonesNotice
        ) : (
          <ol aria-label="Zones to walk-test" className="grid gap-3">
            {zones.map((entry, index) => {
              const loop = zoneLoops.get(entry.zone.id);
              const next = zones[index + 1];
              return (
                <ZoneWalkItem
                  key={entry.zone.id}
                  draftScope={draftScope}
                  entry={entry}
                  design={loop?.design ?? null}
                  bands={loop?.bands ?? []}
                  designProblems={loop?.problems ?? []}
                  onPhone={onPhoneFor(entry.zone.id)}
                  isOpen={openZoneId === entry.zone.id}
                  nextZoneNumber={next ? next.zone.number : null}
                  onToggle={() =>
                    setOpenZoneId((open) => (open === entry.zone.id ? null : entry.zone.id))
                  }
                  onNext={() => {
                    if (next) openZone(next.zone.id);
                  }}
                  outbox={outbox}
                />
              );
            })}
          </ol>
        )}
      </section>

      <section aria-labelledby="system-tests-heading" className="grid gap-4">
        <div>
          <h2 id="system-tests-heading" className="scroll-mt-4 text-xl font-semibold">
            System tests
          </h2>
          <p className="text-sm text-ink-muted">
            The sounders, the signalling path to the monitoring centre, and the standby battery.
          </p>
        </div>
        <SounderTestForm
          {...context}
          lastTest={lastTest('sounders')}
          onPhone={testsOnPhone('sounders')}
        />
        <SignallingTestForm
          {...context}
          lastTest={lastTest('signalling')}
          onPhone={testsOnPhone('signalling')}
          paths={signallingPaths}
          monitored={monitored}
        />
        <BatteryTestForm
          {...context}
          lastTest={lastTest('battery')}
          onPhone={testsOnPhone('battery')}
        />
      </section>

      <PreIssueCheckPanel
        check={check}
        zoneNumbers={new Map(zones.map((entry) => [entry.zone.id, entry.zone.number]))}
        waitingCount={outbox.waiting.length}
        onOpenZone={openZone}
      />
    </div>
  );
}
