import { ChevronDown, ChevronUp, ChevronsRight, TriangleAlert } from 'lucide-react';

import type { LoopDesign } from '@server/calc/loop';
import { STATE_NAMES } from '@server/calc/loop';
import { Button } from '@/components/ui/button';
import type { CommissioningZone } from '@/features/commissioning/api/get-commissioning';
import { SitingCheckForm } from '@/features/commissioning/components/siting-check-form';
import { TestStatusBadge } from '@/features/commissioning/components/test-status';
import { WalkTestForm } from '@/features/commissioning/components/walk-test-form';
import type { OutboxEntry } from '@/features/commissioning/utils/outbox';
import { statusOf } from '@/features/commissioning/utils/test-status';
import { zoneItemId, zonePanelHeadingId } from '@/features/commissioning/utils/zone-ids';
import type { OutboxState } from '@/features/commissioning/utils/use-outbox';
import { bandOf, formatOhms, formatOhmsRange, type BandLike } from '@/lib/loop-readings';
import { formatDateTime } from '@/utils/format';

/** Movement detectors get the siting checklist (common causes of false alarms). */
const SITED_KINDS = new Set(['pir', 'dual_technology']);

function ExpectedBands({ bands }: { bands: readonly BandLike[] }) {
  const normal = bandOf(bands, 'normal');
  const alarm = bandOf(bands, 'alarm');
  if (!normal)
    return (
      <p className="text-sm text-ink-muted">
        No expected readings: the loop is not fully recorded.
      </p>
    );
  return (
    <p className="flex flex-wrap gap-x-4 gap-y-0.5 text-sm">
      <span>
        Normal{' '}
        <span className="font-mono font-semibold">
          {formatOhmsRange(normal.lowOhms, normal.highOhms)}
        </span>
      </span>
      {alarm ? (
        <span>
          Alarm{' '}
          <span className="font-mono font-semibold">
            {formatOhmsRange(alarm.lowOhms, alarm.highOhms)}
          </span>
        </span>
      ) : null}
    </p>
  );
}

function LastTest({ entry }: { entry: CommissioningZone }) {
  const test = entry.lastWalkTest;
  if (!test) return null;
  const secure = test.secureReadingOhms === null ? 'OL' : formatOhms(test.secureReadingOhms);
  const parts = [
    `secure ${secure} ${STATE_NAMES[test.secureState].toLowerCase()}`,
    test.alarmState
      ? `alarm ${test.alarmReadingOhms === null ? 'OL' : formatOhms(test.alarmReadingOhms)} ${STATE_NAMES[test.alarmState].toLowerCase()}`
      : null,
    test.activated ? 'shown on the panel' : 'not shown on the panel',
  ].filter(Boolean);
  return (
    <p className="text-xs text-ink-muted">
      Last test {formatDateTime(test.testedAt)}
      {test.testedBy ? ` by ${test.testedBy}` : ''}: {parts.join(', ')}.
    </p>
  );
}

type ZoneWalkItemProps = {
  /** Whose drafts, for which site: "<user id>:<site id>". */
  draftScope: string;
  entry: CommissioningZone;
  design: LoopDesign | null;
  bands: readonly BandLike[];
  designProblems: readonly string[];
  onPhone: readonly OutboxEntry[];
  isOpen: boolean;
  nextZoneNumber: number | null;
  onToggle: () => void;
  onNext: () => void;
  outbox: OutboxState;
};

/**
 * One zone in the commissioning list: its status and expected bands, and a button that opens its
 * walk test in place. The open zone ends with a bar that stays at the bottom of the screen:
 * save, and on to the next zone, under the thumb.
 */
export function ZoneWalkItem({
  draftScope,
  entry,
  design,
  bands,
  designProblems,
  onPhone,
  isOpen,
  nextZoneNumber,
  onToggle,
  onNext,
  outbox,
}: ZoneWalkItemProps) {
  const { zone } = entry;
  const walkOnPhone = onPhone.filter((item) => item.kind === 'walk-test');
  const status = statusOf(entry.lastWalkTest, walkOnPhone);
  const panelId = `zone-panel-${zone.id}`;
  const formId = `walk-test-${zone.id}`;
  const summaryId = `zone-summary-${zone.id}`;

  return (
    <li id={zoneItemId(zone.id)} className="scroll-mt-4 rounded-lg border border-hairline bg-white">
      <div className="grid gap-2 p-3">
        <div id={summaryId} className="grid gap-1">
          <div className="flex flex-wrap items-baseline justify-between gap-x-3 gap-y-1">
            <p className="font-semibold">
              Zone <span className="font-mono">{zone.number}</span>
              <span className="font-normal"> · {zone.location}</span>
            </p>
            <TestStatusBadge status={status} />
          </div>
          <ExpectedBands bands={bands} />
          {designProblems.length > 0 ? (
            <p className="flex items-start gap-1.5 text-sm font-medium text-alarm">
              <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
              Loop design problem: see the pre-issue check.
            </p>
          ) : null}
          <LastTest entry={entry} />
        </div>
        <Button
          variant={isOpen ? 'primary' : 'secondary'}
          size="lg"
          className="w-full justify-between"
          aria-expanded={isOpen}
          aria-controls={isOpen ? panelId : undefined}
          aria-describedby={summaryId}
          onClick={onToggle}
        >
          Walk-test zone {zone.number}
          {isOpen ? (
            <ChevronUp aria-hidden="true" className="size-5" />
          ) : (
            <ChevronDown aria-hidden="true" className="size-5" />
          )}
        </Button>
      </div>
      {isOpen ? (
        <div id={panelId} className="grid gap-4 border-t border-hairline px-3 pt-4">
          <h3 id={zonePanelHeadingId(zone.id)} tabIndex={-1} className="text-lg font-semibold">
            Walk test: zone <span className="font-mono">{zone.number}</span>, {zone.location}
          </h3>
          <WalkTestForm
            draftScope={draftScope}
            zone={zone}
            design={design}
            bands={bands}
            formId={formId}
            submit={outbox.submit}
            onPhone={onPhone}
          />
          {SITED_KINDS.has(zone.detectorKind) ? (
            <SitingCheckForm
              draftScope={draftScope}
              zone={zone}
              lastCheck={entry.siting}
              submit={outbox.submit}
              onPhone={onPhone}
            />
          ) : null}
          <div className="sticky bottom-0 z-10 -mx-3 flex gap-3 border-t border-hairline bg-white/95 px-3 py-3 backdrop-blur-sm">
            <Button
              type="submit"
              form={formId}
              size="lg"
              className="flex-[3] px-3 whitespace-nowrap"
            >
              Save walk test
            </Button>
            <Button
              variant="secondary"
              size="lg"
              className="flex-[2] px-3 whitespace-nowrap"
              onClick={onNext}
              disabled={nextZoneNumber === null}
              aria-describedby={nextZoneNumber === null ? undefined : `${panelId}-next`}
            >
              Next zone
              <ChevronsRight aria-hidden="true" className="size-5" />
            </Button>
            <span id={`${panelId}-next`} className="sr-only">
              {nextZoneNumber === null ? 'This is the last zone.' : `Zone ${nextZoneNumber}`}
            </span>
          </div>
        </div>
      ) : null}
    </li>
  );
}
