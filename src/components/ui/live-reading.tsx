import { classifyReading, STATE_NAMES, type LoopDesign } from '@server/calc/loop';
import { LoopGauge, LoopStateBadge } from '@/components/ui/loop-gauge';
import {
  describeMargin,
  parseReading,
  toGaugeBands,
  toGaugeState,
  type BandLike,
} from '@/lib/loop-readings';

type LiveReadingProps = {
  text: string;
  design: LoopDesign | null;
  bands: readonly BandLike[];
  /** The state this reading should show: normal with the zone secure, alarm when walked. */
  expected: 'normal' | 'alarm';
  /** Only the secure reading draws the gauge; the alarm reading is said in words. */
  showGauge?: boolean;
};

/**
 * What a reading means on this zone's loop, worked out on the phone as it is typed (the API
 * gives the verdict on saving). Shown in words and an icon, with the gauge for the secure one.
 */
export function LiveReading({
  text,
  design,
  bands,
  expected,
  showGauge = false,
}: LiveReadingProps) {
  const reading = parseReading(text);
  if (reading.status === 'empty') return null;
  if (reading.status === 'invalid') {
    return <p className="mt-1 text-sm text-ink-muted">Not a reading yet: {reading.message}</p>;
  }
  if (!design || bands.length === 0) {
    return (
      <p className="mt-1 text-sm text-ink-muted">
        No bands to check it against: the zone&rsquo;s loop is not fully recorded.
      </p>
    );
  }
  let classification: ReturnType<typeof classifyReading>;
  try {
    classification = classifyReading(design, reading.ohms);
  } catch {
    return null;
  }
  const asExpected = classification.state === expected;
  const margin = describeMargin(
    classification.state,
    classification.band.state,
    Number.isFinite(classification.marginOhms) ? classification.marginOhms : null,
  );
  const note = `${margin ? `(${margin}) ` : ''}${asExpected ? '— as expected.' : `— expected ${STATE_NAMES[expected].toLowerCase()}.`}`;
  if (showGauge) {
    return (
      <LoopGauge
        bands={toGaugeBands(bands)}
        readingOhms={reading.ohms}
        readingNote={<span className="font-medium">{note}</span>}
        bandsInCaption={false}
        className="mt-2"
      />
    );
  }
  return (
    <p className="mt-2 flex flex-wrap items-center gap-x-2 gap-y-1 text-sm">
      <span>Reads as</span>
      <LoopStateBadge state={toGaugeState(classification.state)} />
      <span className="font-medium">{note}</span>
    </p>
  );
}
