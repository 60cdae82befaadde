import { Info, TriangleAlert } from 'lucide-react';

import { loopBands, STATE_NAMES } from '@server/calc/loop';
import { isPreferred } from '@server/calc/preferred-values';
import type { LoopWiring } from '@server/zones/schema';
import { LoopGauge } from '@/components/ui/loop-gauge';
import { expectedReadings } from '@/features/zones/utils/expected-readings';
import {
  formatOhms,
  formatOhmsRange,
  toGaugeBands,
  zoneLoopDesign,
  type LoopSettings,
} from '@/lib/loop-readings';
import { cn } from '@/utils/cn';

type ZoneLoopCheckProps = {
  wiring: LoopWiring | undefined;
  tamperOhms: unknown;
  alarmOhms: unknown;
  cableMetres: unknown;
  coresPerLeg: unknown;
  settings: LoopSettings;
  className?: string;
};

const isValue = (ohms: unknown): ohms is number =>
  typeof ohms === 'number' && Number.isFinite(ohms) && ohms > 0;

const percent = (fraction: number) => `±${Number((fraction * 100).toPrecision(2))} %`;

function cableAllowance(
  cableMetres: unknown,
  coresPerLeg: unknown,
  settings: LoopSettings,
  cable: { min: number; max: number },
): string {
  if (typeof cableMetres !== 'number' || !Number.isFinite(cableMetres)) {
    return `cable run not recorded, so up to ${formatOhms(cable.max)} is allowed for it`;
  }
  const cores = typeof coresPerLeg === 'number' ? coresPerLeg : 1;
  return (
    `${cableMetres} m of ${settings.cableCore}, ${cores} ${cores === 1 ? 'core' : 'cores'} per leg: ` +
    `${formatOhmsRange(cable.min, cable.max)} of cable at 0–40 °C`
  );
}

/** Resistor values that are not on the E24 series: usually a misread band or a typing slip. */
function unusualValues(tamperOhms: unknown, alarmOhms: unknown): string[] {
  return [
    ['tamper', tamperOhms],
    ['alarm', alarmOhms],
  ].flatMap(([name, ohms]) =>
    isValue(ohms) && Number.isInteger(ohms) && ohms >= 10 && !isPreferred(ohms, 'E24')
      ? [
          `The ${name} resistor, ${formatOhms(ohms)}, is not an E12 or E24 preferred value: check the resistor fitted.`,
        ]
      : [],
  );
}

/**
 * The readings a meter should show on this zone, worked out live from the row: every band with
 * its edges (resistor tolerance and cable resistance included), the loop gauge, and any reason
 * the design cannot work. It uses no list markup, so the schedule's rows stay its only items.
 */
export function ZoneLoopCheck({
  wiring,
  tamperOhms,
  alarmOhms,
  cableMetres,
  coresPerLeg,
  settings,
  className,
}: ZoneLoopCheckProps) {
  const heading = (
    <p className="mb-0.5 text-xs font-medium">
      Expected readings{' '}
      <span className="font-normal text-ink-muted">
        (resistors {percent(settings.resistorTolerance)}, cable included)
      </span>
    </p>
  );
  if (!wiring) {
    return (
      <div className={cn('min-w-0', className)}>
        {heading}
        <p className="flex min-h-9 items-center text-xs text-ink-muted">
          Choose the loop wiring first.
        </p>
      </div>
    );
  }
  const design = zoneLoopDesign(
    { loopWiring: wiring, tamperOhms, alarmOhms, cableMetres, coresPerLeg },
    settings,
  );
  const { bands, problems } = loopBands(design);
  if (bands.length === 0) {
    return (
      <div className={cn('min-w-0', className)}>
        {heading}
        <p className="flex min-h-9 items-center text-xs text-ink-muted">
          Enter the resistor values to see them.
        </p>
      </div>
    );
  }
  const nominal = expectedReadings(wiring, tamperOhms, alarmOhms);
  const unusual = unusualValues(tamperOhms, alarmOhms);

  return (
    <div className={cn('grid min-w-0 gap-2', className)}>
      <div className="grid gap-x-6 gap-y-2 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)]">
        <div className="min-w-0">
          {heading}
          <p className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
            {bands.map((band) => (
              <span key={band.state}>
                <span className="font-medium">{STATE_NAMES[band.state]}</span>{' '}
                <span className="font-mono">{formatOhmsRange(band.lowOhms, band.highOhms)}</span>
              </span>
            ))}
          </p>
          {nominal ? (
            <p className="mt-1 text-xs text-ink-muted">
              Nominal <span className="font-mono text-ink">{nominal.normal}</span> secure,{' '}
              <span className="font-mono text-ink">{nominal.alarm}</span> in alarm, before tolerance
              and cable; {cableAllowance(cableMetres, coresPerLeg, settings, design.cableOhms)}.
            </p>
          ) : null}
        </div>
        <LoopGauge
          bands={toGaugeBands(bands)}
          bandsInCaption={false}
          className="max-w-md self-end"
        />
      </div>
      {problems.map((problem) => (
        <p
          key={problem}
          className="flex items-start gap-2 rounded-md border border-l-4 border-hairline border-l-alarm bg-white px-3 py-2 text-sm"
        >
          <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-alarm" />
          <span>
            <span className="font-semibold">Design problem: </span>
            {problem}
          </span>
        </p>
      ))}
      {unusual.map((message) => (
        <p key={message} className="flex items-start gap-2 text-xs">
          <Info aria-hidden="true" className="mt-0.5 size-3.5 shrink-0 text-info" />
          <span>
            <span className="font-semibold">Check: </span>
            {message}
          </span>
        </p>
      ))}
    </div>
  );
}
