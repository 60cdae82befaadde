import type { ServiceVisit } from '@server/service/schema';
import { Link } from 'react-router-dom';

import {
  formatLongDay,
  formatMonth,
  monthWeeks,
  ukTimeOf,
  WEEKDAYS,
} from '@/features/service/utils/uk-calendar';
import {
  isPastDue,
  kindLabel,
  VISIT_STATUS_LABELS,
  visitDay,
  visitLinkId,
} from '@/features/service/utils/visit-words';
import { cn } from '@/utils/cn';

type VisitCalendarProps = {
  month: string;
  visits: readonly ServiceVisit[];
  today: string;
  visitHref: (visitId: string) => string;
  selectedVisitId?: string;
};

/**
 * What a calendar entry does not show but a screen reader should say, after the visible words
 * (so the link's name starts with what is on screen, for speech users).
 */
function unseenWords(visit: ServiceVisit, today: string): string {
  const parts = [kindLabel(visit), visit.engineer ? visit.engineer.name : 'no engineer yet'];
  if (!visit.scheduledFor) parts.push('no time yet');
  if (visit.status !== 'scheduled') parts.push(VISIT_STATUS_LABELS[visit.status]);
  if (isPastDue(visit, today)) parts.push('past its due date');
  return `, ${parts.join(', ')}`;
}

/**
 * The month as a grid of weeks from Monday. It is a list of days in reading order: the columns
 * are for the eye, and each day names its own weekday for screen readers.
 */
export function VisitCalendar({
  month,
  visits,
  today,
  visitHref,
  selectedVisitId,
}: VisitCalendarProps) {
  const byDay = new Map<string, ServiceVisit[]>();
  for (const visit of visits) {
    const day = visitDay(visit);
    byDay.set(day, [...(byDay.get(day) ?? []), visit]);
  }
  const days = monthWeeks(month).flat();

  return (
    <div className="overflow-x-auto px-4 py-4 md:px-5">
      <div className="min-w-[35rem]">
        <div aria-hidden="true" className="grid grid-cols-7 gap-px pb-1">
          {WEEKDAYS.map((weekday) => (
            <div key={weekday.short} className="px-2 text-xs font-semibold text-ink-muted">
              {weekday.short}
            </div>
          ))}
        </div>
        <ol
          aria-label={`Visits in ${formatMonth(month)}, day by day`}
          className="grid grid-cols-7 gap-px border border-hairline bg-hairline"
        >
          {days.map((day, index) =>
            day === null ? (
              <li key={`blank-${index}`} aria-hidden="true" className="min-h-24 bg-paper" />
            ) : (
              <CalendarDay
                key={day}
                day={day}
                visits={byDay.get(day) ?? []}
                today={today}
                visitHref={visitHref}
                selectedVisitId={selectedVisitId}
              />
            ),
          )}
        </ol>
      </div>
    </div>
  );
}

type CalendarDayProps = {
  day: string;
  visits: readonly ServiceVisit[];
  today: string;
  visitHref: (visitId: string) => string;
  selectedVisitId?: string;
};

function CalendarDay({ day, visits, today, visitHref, selectedVisitId }: CalendarDayProps) {
  const isToday = day === today;
  return (
    <li
      className={cn(
        'min-h-24 bg-white p-1.5',
        isToday && 'outline-2 -outline-offset-2 outline-brass',
      )}
    >
      <p className="flex items-baseline justify-between gap-1 text-xs">
        <span className="sr-only">{formatLongDay(day)}</span>
        <span aria-hidden="true" className="font-mono font-semibold">
          {Number(day.slice(8))}
        </span>
        {isToday ? <span className="font-semibold text-ink">Today</span> : null}
        {visits.length > 0 ? (
          <span className="sr-only">
            {visits.length === 1 ? ', 1 visit' : `, ${visits.length} visits`}
          </span>
        ) : null}
      </p>
      {visits.length > 0 ? (
        <ul className="mt-1 grid gap-1">
          {visits.map((visit) => (
            <li key={visit.id}>
              <Link
                id={visitLinkId(visit.id, 'calendar')}
                to={visitHref(visit.id)}
                aria-current={visit.id === selectedVisitId ? 'true' : undefined}
                className={cn(
                  'block min-h-6 rounded-sm border-l-4 px-1 py-0.5 text-xs leading-snug no-underline',
                  visit.status === 'cancelled'
                    ? 'border-hairline bg-paper text-ink-muted line-through'
                    : isPastDue(visit, today)
                      ? 'border-fault bg-paper-deep text-ink'
                      : 'border-brass bg-paper-deep text-ink',
                  visit.id === selectedVisitId && 'ring-2 ring-ink',
                )}
              >
                {/* One item a line: a day is a seventh of the width. */}
                {visit.scheduledFor ? (
                  <span className="block font-mono font-semibold">
                    {ukTimeOf(visit.scheduledFor)}{' '}
                  </span>
                ) : null}
                <span className="block font-mono">{visit.siteReference} </span>
                <span className="block truncate">{visit.siteName}</span>
                <span className="sr-only">{unseenWords(visit, today)}</span>
              </Link>
            </li>
          ))}
        </ul>
      ) : null}
    </li>
  );
}
