import type { ReactNode } from 'react';
import { CircleCheck, Siren, TriangleAlert, Unplug, Zap, type LucideIcon } from 'lucide-react';

import { formatOhms, formatOhmsRange } from '@/lib/loop-readings';
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
  return formatOhmsRange(segment.fromOhms, segment.toOhms);
}

type LoopGaugeProps = {
  bands: readonly LoopGaugeBand[];
  /** The measured reading (Infinity for a meter's OL); without one the gauge shows the bands only. */
  readingOhms?: number | null;
  /** Said after the reading's state in the caption: how far inside its band, what was expected. */
  readingNote?: ReactNode;
  /**
   * Whether the caption lists every band in words. Off where the bands are already written out
   * beside the gauge, so they are not read (or matched) twice.
   */
  bandsInCaption?: boolean;
  className?: string;
};

/** Every band in words, lowest first: "Short circuit 0–40 Ω; Normal 2.09–2.34 kΩ; …". */
function bandsInWords(segments: readonly Segment[]): string {
  return segments
    .filter((segment) => segment.state !== 'out-of-tolerance')
    .map((segment) => `${stateNames[segment.state]} ${describeBand(segment)}`)
    .join('; ');
}

/**
 * Wardbook's loop gauge: a resistance scale with the short / normal / alarm / open bands and the
 * measured reading marked. The drawing is hidden from screen readers; the caption says it in words.
 */
export function LoopGauge({
  bands,
  readingOhms = null,
  readingNote,
  bandsInCaption = true,
  className,
}: LoopGaugeProps) {
  const segments = layOutSegments(bands);
  const measured = readingOhms !== null && !Number.isNaN(readingOhms) ? readingOhms : null;
  const reading = measured === null ? null : locateReading(segments, measured);
  const readingSegment = reading
    ? segments.find((segment) => segment.state === reading.state)
    : undefined;

  return (
    // With no reading and the bands written out beside it, the drawing adds nothing to say.
    <figure
      aria-hidden={reading === null && !bandsInCaption ? true : undefined}
      className={cn('w-full', className)}
    >
      <div aria-hidden="true" className={cn('relative', reading ? 'pt-8' : 'pt-1')}>
        {reading && measured !== null ? (
          <div
            className="absolute top-0 flex -translate-x-1/2 flex-col items-center"
            style={{ left: `${reading.percent}%` }}
          >
            <span className="rounded bg-ink px-1.5 py-0.5 font-mono text-xs font-semibold whitespace-nowrap text-paper">
              {Number.isFinite(measured) ? formatOhms(measured) : 'OL'}
            </span>
            <span className="h-5 w-0.5 bg-ink" />
          </div>
        ) : null}
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
                  <span className="block font-mono text-[0.6875rem] break-words text-ink-muted">
                    {describeBand(segment)}
                  </span>
                </>
              )}
            </div>
          ))}
        </div>
      </div>
      {reading && measured !== null ? (
        <figcaption className="mt-3 text-sm">
          Reading <span className="font-mono font-semibold">{formatOhms(measured)}</span>:{' '}
          <LoopStateBadge state={reading.state} />
          {readingSegment && reading.state !== 'out-of-tolerance'
            ? ` (band ${describeBand(readingSegment)})`
            : null}
          {readingNote ? <> {readingNote}</> : null}
          {bandsInCaption ? (
            <span className="sr-only">. Bands: {bandsInWords(segments)}.</span>
          ) : null}
        </figcaption>
      ) : bandsInCaption ? (
        <figcaption className="sr-only">Expected bands: {bandsInWords(segments)}.</figcaption>
      ) : null}
    </figure>
  );
}
