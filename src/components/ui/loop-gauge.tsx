import { CircleCheck, Siren, TriangleAlert, Unplug, Zap, type LucideIcon } from 'lucide-react';

import { cn } from '@/utils/cn';

export type LoopReadingState = 'short' | 'normal' | 'alarm' | 'open' | 'out-of-tolerance';

// Names from the trade's own vocabulary for loop readings.
const stateNames: Record<LoopReadingState, string> = {
  short: 'Short circuit',
  normal: 'Normal',
  alarm: 'Alarm',
  open: 'Open circuit',
  'out-of-tolerance': 'Out of tolerance',
};

const shortStateNames: Record<LoopReadingState, string> = {
  short: 'Short',
  normal: 'Normal',
  alarm: 'Alarm',
  open: 'Open',
  'out-of-tolerance': 'Out of tolerance',
};

const stateStyles: Record<LoopReadingState, { bar: string; text: string; icon: LucideIcon }> = {
  short: { bar: 'bg-fault', text: 'text-fault-text', icon: Zap },
  normal: { bar: 'bg-normal', text: 'text-normal', icon: CircleCheck },
  alarm: { bar: 'bg-alarm', text: 'text-alarm', icon: Siren },
  open: { bar: 'bg-fault', text: 'text-fault-text', icon: Unplug },
  'out-of-tolerance': { bar: 'bg-paper-deep', text: 'text-fault-text', icon: TriangleAlert },
};

function formatOhms(ohms: number): string {
  if (ohms >= 1_000_000) return `${Number((ohms / 1_000_000).toPrecision(3))} MΩ`;
  if (ohms >= 1_000) return `${Number((ohms / 1_000).toPrecision(3))} kΩ`;
  return `${Math.round(ohms)} Ω`;
}

export function LoopStateBadge({ state }: { state: LoopReadingState }) {
  const style = stateStyles[state];
  const Icon = style.icon;
  return (
    <span className={cn('inline-flex items-center gap-1.5 font-semibold', style.text)}>
      <Icon aria-hidden="true" className="size-4 shrink-0" />
      {stateNames[state]}
    </span>
  );
}

export type LoopGaugeBand = {
  state: Exclude<LoopReadingState, 'out-of-tolerance'>;
  fromOhms: number;
  /** null for the open-ended top band. */
  toOhms: number | null;
};

type Segment = {
  state: LoopReadingState;
  fromOhms: number;
  toOhms: number | null;
  startPercent: number;
  widthPercent: number;
};

// Bands are drawn wider than the gaps between them, and all bands alike, so a narrow normal band
// stays readable; a reading is placed proportionally inside whichever segment holds it.
const bandWeight = 3;
const gapWeight = 1;
const openBandMarkerRatio = 0.35;

function layOutSegments(bands: readonly LoopGaugeBand[]): Segment[] {
  const sorted = [...bands].sort((a, b) => a.fromOhms - b.fromOhms);
  const pieces: Array<Omit<Segment, 'startPercent' | 'widthPercent'> & { weight: number }> = [];
  let previousEnd = 0;
  for (const band of sorted) {
    if (band.fromOhms > previousEnd) {
      pieces.push({
        state: 'out-of-tolerance',
        fromOhms: previousEnd,
        toOhms: band.fromOhms,
        weight: gapWeight,
      });
    }
    pieces.push({ ...band, weight: bandWeight });
    previousEnd = band.toOhms ?? Number.POSITIVE_INFINITY;
  }

  const totalWeight = pieces.reduce((sum, piece) => sum + piece.weight, 0);
  let startPercent = 0;
  return pieces.map(({ weight, ...piece }) => {
    const widthPercent = (weight / totalWeight) * 100;
    const segment = { ...piece, startPercent, widthPercent };
    startPercent += widthPercent;
    return segment;
  });
}

function locateReading(segments: readonly Segment[], readingOhms: number) {
  const segment =
    segments.find(
      (candidate) =>
        readingOhms >= candidate.fromOhms &&
        (candidate.toOhms === null || readingOhms < candidate.toOhms),
    ) ?? segments.at(-1);
  if (!segment) return { state: 'out-of-tolerance' as const, percent: 0 };
  const ratio =
    segment.toOhms === null
      ? openBandMarkerRatio
      : (readingOhms - segment.fromOhms) / (segment.toOhms - segment.fromOhms);
  return {
    state: segment.state,
    percent: segment.startPercent + Math.min(Math.max(ratio, 0), 1) * segment.widthPercent,
  };
}

// Both ends share the unit of the upper one, so a range stays short: "3.8–5.6 kΩ".
function describeBand(segment: Segment): string {
  if (segment.toOhms === null) return `over ${formatOhms(segment.fromOhms)}`;
  const [divisor, unit] =
    segment.toOhms >= 1_000_000
      ? [1_000_000, 'MΩ']
      : segment.toOhms >= 1_000
        ? [1_000, 'kΩ']
        : [1, 'Ω'];
  const scaled = (ohms: number) => Number((ohms / divisor).toPrecision(3));
  return `${scaled(segment.fromOhms)}–${scaled(segment.toOhms)} ${unit}`;
}

type LoopGaugeProps = {
  bands: readonly LoopGaugeBand[];
  readingOhms: number;
  className?: string;
};

/**
 * Wardbook's loop gauge: a resistance scale with the short / normal / alarm / open bands and the
 * measured reading marked. The drawing is hidden from screen readers; the caption says it in words.
 */
export function LoopGauge({ bands, readingOhms, className }: LoopGaugeProps) {
  const segments = layOutSegments(bands);
  const reading = locateReading(segments, readingOhms);
  const readingSegment = segments.find((segment) => segment.state === reading.state);

  return (
    <figure className={cn('w-full', className)}>
      <div aria-hidden="true" className="relative pt-8">
        <div
          className="absolute top-0 flex -translate-x-1/2 flex-col items-center"
          style={{ left: `${reading.percent}%` }}
        >
          <span className="rounded bg-ink px-1.5 py-0.5 font-mono text-xs font-semibold text-paper">
            {formatOhms(readingOhms)}
          </span>
          <span className="h-5 w-0.5 bg-ink" />
        </div>
        <div className="flex h-3 overflow-hidden rounded-full border border-hairline">
          {segments.map((segment) => (
            <div
              key={`${segment.state}-${segment.fromOhms}`}
              className={stateStyles[segment.state].bar}
              style={{ width: `${segment.widthPercent}%` }}
            />
          ))}
        </div>
        <div className="mt-1.5 flex text-xs">
          {segments.map((segment) => (
            <div
              key={`${segment.state}-${segment.fromOhms}`}
              className="min-w-0 px-0.5 text-center"
              style={{ width: `${segment.widthPercent}%` }}
            >
              {segment.state === 'out-of-tolerance' ? null : (
                <>
                  <span className="block font-medium">{shortStateNames[segment.state]}</span>
                  <span className="block font-mono text-[0.6875rem] text-ink-muted">
                    {describeBand(segment)}
                  </span>
                </>
              )}
            </div>
          ))}
        </div>
      </div>
      <figcaption className="mt-3 text-sm">
        Reading <span className="font-mono font-semibold">{formatOhms(readingOhms)}</span>:{' '}
        <LoopStateBadge state={reading.state} />
        {readingSegment && reading.state !== 'out-of-tolerance'
          ? ` (band ${describeBand(readingSegment)})`
          : null}
      </figcaption>
    </figure>
  );
}
