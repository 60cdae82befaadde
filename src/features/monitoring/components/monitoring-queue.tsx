import type { AlarmEvent } from '@server/monitoring/schema';
import { ListChecks, Siren } from 'lucide-react';
import { Suspense, useEffect, useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';

import { LiveMessage } from '@/components/ui/live-message';
import { LoadingStatus } from '@/components/ui/loading-status';
import { useAlarmEvents, type QueueStatus } from '@/features/monitoring/api/get-alarm-events';
import { useMonitoringStream } from '@/features/monitoring/api/use-monitoring-stream';
import { ActiveEventsTable } from '@/features/monitoring/components/active-events-table';
import { ClosedEventsTable } from '@/features/monitoring/components/closed-events-table';
import { HandlingFigures } from '@/features/monitoring/components/handling-figures';
import { LiveIndicator } from '@/features/monitoring/components/live-indicator';
import { priorityWords } from '@/features/monitoring/utils/priority';
import { categoryLabel } from '@/utils/alarm-words';
import { cn } from '@/utils/cn';

/** The search parameter that picks the tab, so each tab has its own address. */
const TAB_PARAM = 'show';

function describeArrival(event: AlarmEvent): string {
  return `New: ${categoryLabel(event.category)}${event.confirmed ? ', confirmed,' : ''} at ${
    event.siteName ?? `account ${event.account}`
  }, priority ${event.priority} ${priorityWords(event.priority)}.`;
}

/**
 * Tells screen-reader users when an event arrives, without making the whole ticking table a live
 * region (which would read every second).
 */
function useArrivalAnnouncements(events: readonly AlarmEvent[]): string {
  const seen = useRef<Set<string> | null>(null);
  const [message, setMessage] = useState('');
  useEffect(() => {
    const previous = seen.current;
    seen.current = new Set(events.map((event) => event.id));
    if (!previous) return;
    const arrived = events.filter((event) => !previous.has(event.id));
    if (arrived.length === 0) return;
    setMessage(
      arrived.length === 1
        ? describeArrival(arrived[0]!)
        : `${arrived.length} new events. The first: ${describeArrival(arrived[0]!)}`,
    );
  }, [events]);
  return message;
}

function ActiveQueue({ myUserId }: { myUserId: string }) {
  const { data: events } = useAlarmEvents('active');
  const announcement = useArrivalAnnouncements(events);
  const waiting = events.filter((event) => event.status === 'open').length;
  return (
    <>
      <p className="border-b border-hairline px-4 py-2 text-sm md:px-5">
        <span className="font-mono font-semibold">{events.length}</span> active,{' '}
        <span className="font-mono font-semibold">{waiting}</span> waiting to be taken.
      </p>
      <ActiveEventsTable events={events} myUserId={myUserId} />
      <LiveMessage message={announcement} />
    </>
  );
}

function ClosedQueue() {
  const { data: events } = useAlarmEvents('closed');
  return <ClosedEventsTable events={events} />;
}

const tabs: ReadonlyArray<{ status: QueueStatus; label: string; icon: typeof Siren }> = [
  { status: 'active', label: 'Active', icon: Siren },
  { status: 'closed', label: 'Recently closed', icon: ListChecks },
];

/** The operator's live queue: handling figures, the live feed's state and two tabs. */
export function MonitoringQueue({ myUserId }: { myUserId: string }) {
  const streamState = useMonitoringStream();
  const [searchParams] = useSearchParams();
  const current: QueueStatus = searchParams.get(TAB_PARAM) === 'closed' ? 'closed' : 'active';

  return (
    <div className="grid gap-4">
      <HandlingFigures />
      <section
        aria-labelledby="queue-heading"
        className="overflow-hidden rounded-lg border border-hairline bg-white"
      >
        <div className="flex flex-wrap items-center gap-3 border-b border-hairline px-4 py-3 md:px-5">
          <h2 id="queue-heading" className="text-lg font-semibold">
            Signal queue
          </h2>
          <div className="ml-auto">
            <LiveIndicator state={streamState} />
          </div>
        </div>
        <nav aria-label="Queue views" className="px-4 md:px-5">
          <ul className="flex gap-1 border-b border-hairline">
            {tabs.map((tab) => {
              const isCurrent = tab.status === current;
              return (
                <li key={tab.status}>
                  <Link
                    to={{ search: tab.status === 'active' ? '' : `?${TAB_PARAM}=closed` }}
                    aria-current={isCurrent ? 'page' : undefined}
                    className={cn(
                      '-mb-px flex min-h-11 items-center gap-2 border-b-4 px-3 text-sm font-semibold no-underline',
                      isCurrent
                        ? 'border-brass text-ink'
                        : 'border-transparent text-ink-muted hover:border-hairline hover:text-ink',
                    )}
                  >
                    <tab.icon aria-hidden="true" className="size-4 shrink-0" />
                    {tab.label}
                  </Link>
                </li>
              );
            })}
          </ul>
        </nav>
        <Suspense
          fallback={<LoadingStatus label="Loading the queue" className="px-4 py-4 md:px-5" />}
        >
          {current === 'active' ? <ActiveQueue myUserId={myUserId} /> : <ClosedQueue />}
        </Suspense>
      </section>
    </div>
  );
}
