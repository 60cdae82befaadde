import type { LoopWiring } from '@server/zones/schema';
import { expectedReadings } from '@/features/zones/utils/expected-readings';
import { cn } from '@/utils/cn';

type ExpectedReadingsNoteProps = {
  wiring: LoopWiring | undefined;
  tamperOhms: unknown;
  alarmOhms: unknown;
  className?: string;
};

/** The meter readings the resistor values imply, in words, before any cable is counted. */
export function ExpectedReadingsNote({
  wiring,
  tamperOhms,
  alarmOhms,
  className,
}: ExpectedReadingsNoteProps) {
  const readings = expectedReadings(wiring, tamperOhms, alarmOhms);
  return (
    <div className={cn('min-w-0', className)}>
      <p className="mb-0.5 text-xs font-medium">
        Expected readings{' '}
        <span className="font-normal text-ink-muted">(nominal, before cable resistance)</span>
      </p>
      {readings ? (
        <p className="flex min-h-9 flex-wrap items-center gap-x-4 gap-y-1 text-sm">
          <span>
            Normal <span className="font-mono font-semibold">{readings.normal}</span>
          </span>
          <span>
            Alarm <span className="font-mono font-semibold">{readings.alarm}</span>
          </span>
        </p>
      ) : (
        <p className="flex min-h-9 items-center text-xs text-ink-muted">
          {wiring ? 'Enter the resistor values to see them.' : 'Choose the loop wiring first.'}
        </p>
      )}
    </div>
  );
}
