import { ScrollText } from 'lucide-react';

import type { AlarmEventDetail } from '@/features/monitoring/api/get-alarm-event';

type TimelineEntry = AlarmEventDetail['timeline'][number];

const timeOfDay = new Intl.DateTimeFormat('en-GB', {
  hour: '2-digit',
  minute: '2-digit',
  second: '2-digit',
});
const dayAndTime = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  hour: '2-digit',
  minute: '2-digit',
  second: '2-digit',
});

/** Seconds matter on the day; an entry from an earlier day also says which day. */
function entryTime(iso: string, today: string): string {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return iso;
  return date.toDateString() === today ? timeOfDay.format(date) : dayAndTime.format(date);
}

function whoDidIt(entry: TimelineEntry): string {
  return entry.actor ?? 'Wardbook';
}

/**
 * Everything that happened to the event, oldest first and the newest at the bottom, as a log:
 * screen readers announce entries added while the page is open.
 */
export function EventTimeline({ timeline }: { timeline: AlarmEventDetail['timeline'] }) {
  const today = new Date().toDateString();
  return (
    <section
      aria-labelledby="timeline-heading"
      className="overflow-hidden rounded-lg border border-hairline bg-white"
    >
      <div className="flex items-center gap-2 border-b border-hairline px-4 py-3 md:px-5">
        <ScrollText aria-hidden="true" className="size-5 shrink-0" />
        <h2 id="timeline-heading" className="text-base font-semibold">
          Timeline
        </h2>
      </div>
      <div role="log" aria-labelledby="timeline-heading">
        <ol className="divide-y divide-hairline">
          {timeline.map((entry, index) => (
            <li
              key={`${entry.at}-${index}`}
              className="grid gap-x-4 px-4 py-2 text-sm sm:grid-cols-[7.5rem_minmax(0,1fr)] md:px-5"
            >
              <time dateTime={entry.at} className="font-mono text-ink-muted tabular-nums">
                {entryTime(entry.at, today)}
              </time>
              <div className="min-w-0">
                <p className="break-words">{entry.text}</p>
                <p className="text-xs text-ink-muted">{whoDidIt(entry)}</p>
              </div>
            </li>
          ))}
        </ol>
      </div>
    </section>
  );
}
