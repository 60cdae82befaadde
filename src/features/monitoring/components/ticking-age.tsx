import { useNow } from '@/lib/use-now';
import { formatElapsedSince } from '@/utils/elapsed';
import { formatDateTime } from '@/utils/format';

/**
 * How long ago something happened, counting up each second. The exact time is in the element's
 * machine-readable form and its tooltip; screen readers are not told every tick.
 */
export function TickingAge({ since }: { since: string }) {
  const now = useNow();
  return (
    <time dateTime={since} title={formatDateTime(since)} className="font-mono tabular-nums">
      {formatElapsedSince(since, now)}
    </time>
  );
}
