import { ChevronDown, RadioTower } from 'lucide-react';
import { useState } from 'react';

import { Button } from '@/components/ui/button';
import { LiveMessage } from '@/components/ui/live-message';
import { useHomeSignals, type HomeSignal } from '@/features/my-homes/api/get-home-signals';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import { categoryLabel } from '@/utils/alarm-words';
import { formatDateTime } from '@/utils/format';

const itemId = (signalId: string) => `signal-${signalId}`;

function SignalItem({ signal }: { signal: HomeSignal }) {
  return (
    <li id={itemId(signal.id)} tabIndex={-1} className="grid gap-0.5 px-4 py-3">
      <p className="font-semibold">{signal.description || categoryLabel(signal.category)}</p>
      {/* Contact ID reports zone 000 for signals that concern no detector (tests, faults). */}
      {signal.zone !== null && signal.zone > 0 ? (
        <p className="text-ink-muted">
          Zone <span className="font-mono">{signal.zone}</span>
          {signal.zoneName ? `: ${signal.zoneName}` : ''}
        </p>
      ) : null}
      <p className="text-sm text-ink-muted">
        <time dateTime={signal.at}>{formatDateTime(signal.at)}</time>
      </p>
    </li>
  );
}

/**
 * Every signal the home's system has sent to the monitoring centre, newest first, a page at a
 * time. "Show older" moves focus to the first of the older signals, so nobody loses their place.
 */
export function SignalHistory({ siteId }: { siteId: string }) {
  const { data, hasNextPage, fetchNextPage, isFetchingNextPage, error } = useHomeSignals(siteId);
  const focusAfterRender = useFocusAfterRender();
  const [announcement, setAnnouncement] = useState('');
  const signals = data.pages.flatMap((page) => page.signals);

  const showOlder = async () => {
    setAnnouncement('');
    const result = await fetchNextPage();
    const older = result.data?.pages.at(-1)?.signals ?? [];
    if (older.length > 0) {
      focusAfterRender(itemId(older[0]!.id));
      setAnnouncement(`${older.length} older ${older.length === 1 ? 'signal' : 'signals'} shown.`);
    }
  };

  return (
    <section
      aria-labelledby="signal-history-heading"
      className="overflow-hidden rounded-lg border border-hairline bg-white"
    >
      <div className="flex items-center gap-2 border-b border-hairline px-4 py-3">
        <RadioTower aria-hidden="true" className="size-5 shrink-0" />
        <h3 id="signal-history-heading" className="text-lg font-semibold">
          Signals received
        </h3>
      </div>
      {signals.length === 0 ? (
        <p className="px-4 py-4">
          No signals from this home have reached the monitoring centre yet.
        </p>
      ) : (
        <ol aria-label="Signals, newest first" className="divide-y divide-hairline">
          {signals.map((signal) => (
            <SignalItem key={signal.id} signal={signal} />
          ))}
        </ol>
      )}
      <div className="grid gap-2 border-t border-hairline px-4 py-3">
        {hasNextPage ? (
          <Button
            variant="secondary"
            size="lg"
            disabled={isFetchingNextPage}
            onClick={() => void showOlder()}
          >
            <ChevronDown aria-hidden="true" className="size-5" />
            {isFetchingNextPage ? 'Loading older signals…' : 'Show older'}
          </Button>
        ) : signals.length > 0 ? (
          <p className="text-sm text-ink-muted">That is every signal on record.</p>
        ) : null}
        {error && !isFetchingNextPage ? (
          <p role="alert" className="font-medium text-alarm">
            Older signals could not be loaded. Try again in a moment.
          </p>
        ) : null}
        <LiveMessage message={announcement} />
      </div>
    </section>
  );
}
