import type { AlarmEvent } from '@server/monitoring/schema';
import { Link, useNavigate } from 'react-router-dom';

import { paths } from '@/config/paths';
import { ConfirmedBadge } from '@/features/monitoring/components/confirmed-badge';
import { EventHandlingStatus } from '@/features/monitoring/components/event-handling-status';
import { PriorityMarker } from '@/features/monitoring/components/priority-marker';
import { TickingAge } from '@/features/monitoring/components/ticking-age';
import { categoryTone, priorityWords } from '@/features/monitoring/utils/priority';
import { categoryLabel } from '@/utils/alarm-words';
import { cn } from '@/utils/cn';

// The heavier the priority, the wider the bar down the row's left edge: weight, not only colour.
const barWidths: Record<number, string> = { 1: 'border-l-8', 2: 'border-l-8', 3: 'border-l-4' };
const barColours = { alarm: 'border-l-alarm', fault: 'border-l-fault', info: 'border-l-info' };

type ActiveEventsTableProps = { events: readonly AlarmEvent[]; myUserId: string };

/** The live queue, in the order the API gives: priority first, then the longest waiting. */
export function ActiveEventsTable({ events, myUserId }: ActiveEventsTableProps) {
  const navigate = useNavigate();
  if (events.length === 0) {
    return (
      <p className="px-4 py-6 text-ink-muted md:px-5">
        Nothing is waiting. New alarms, tampers and faults appear here the moment they arrive.
      </p>
    );
  }
  return (
    <div role="region" aria-label="Active events" tabIndex={0} className="overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm">
        <caption className="sr-only">
          Active events, highest priority first, then the longest waiting
        </caption>
        <thead className="bg-paper-deep">
          <tr>
            {['Priority', 'Event', 'Site', 'Zones', 'Waiting for', 'Handling'].map((header) => (
              <th key={header} scope="col" className="px-3 py-2 font-semibold whitespace-nowrap">
                {header}
              </th>
            ))}
          </tr>
        </thead>
        <tbody className="divide-y divide-hairline">
          {events.map((event) => {
            const href = paths.monitoringEvent.getHref(event.id);
            const label = categoryLabel(event.category);
            const siteName = event.siteName ?? `Unknown account ${event.account}`;
            return (
              <tr
                key={event.id}
                data-event-id={event.id}
                // The link in the Event cell is the keyboard's way in; a click anywhere on the
                // row does the same for the mouse.
                onClick={(click) => {
                  if ((click.target as HTMLElement).closest('a')) return;
                  void navigate(href);
                }}
                className={cn(
                  'cursor-pointer align-top hover:bg-paper',
                  barWidths[event.priority] ?? 'border-l-2',
                  barColours[categoryTone(event.category)],
                  event.status === 'open' && event.priority <= 3 && 'bg-white font-medium',
                )}
              >
                <td className="px-3 py-2.5">
                  <PriorityMarker priority={event.priority} />
                </td>
                <th scope="row" className="px-3 py-2.5 text-left font-normal">
                  <Link
                    to={href}
                    className={cn(event.priority <= 3 ? 'font-bold' : 'font-semibold')}
                    aria-label={`${label}${event.confirmed ? ', confirmed,' : ''} at ${siteName}, priority ${event.priority} ${priorityWords(event.priority)}`}
                  >
                    {label}
                  </Link>
                  {event.confirmed ? (
                    <span className="ml-2 inline-block align-middle">
                      <ConfirmedBadge />
                    </span>
                  ) : null}
                  {event.restoredAt ? (
                    <span className="block text-xs text-ink-muted">Restored since</span>
                  ) : null}
                </th>
                <td className="px-3 py-2.5">
                  <span className="block">{siteName}</span>
                  <span className="block font-mono text-xs text-ink-muted">
                    {event.siteReference ? `${event.siteReference} · ` : ''}account {event.account}
                  </span>
                </td>
                <td className="px-3 py-2.5 font-mono">
                  {event.zones.length > 0 ? event.zones.join(', ') : '–'}
                </td>
                <td className="px-3 py-2.5 whitespace-nowrap">
                  <TickingAge since={event.firstSignalAt} />
                </td>
                <td className="px-3 py-2.5">
                  <EventHandlingStatus event={event} myUserId={myUserId} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
