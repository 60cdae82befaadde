import { VISIT_KIND_LABELS, type ServiceVisit, type VisitStatus } from '@server/service/schema';

import { formatCalendarDate } from '@/lib/dates';
import { formatShortDay, ukDayOf, ukTimeOf } from '@/features/service/utils/uk-calendar';

export const VISIT_STATUS_LABELS: Record<VisitStatus, string> = {
  scheduled: 'Scheduled',
  done: 'Done',
  cancelled: 'Cancelled',
};

/**
 * The day a visit shows on: the booked day where it has one, else its due date. The API files
 * visits under the same day (server/service/repository.ts, listVisits).
 */
export function visitDay(visit: Pick<ServiceVisit, 'scheduledFor' | 'dueDate'>): string {
  return visit.scheduledFor ? ukDayOf(visit.scheduledFor) : visit.dueDate;
}

/** "Tue 9 Mar, 09:30", or "Not booked yet" for a visit that only has a due date. */
export function describeBooking(scheduledFor: string | null): string {
  if (!scheduledFor) return 'Not booked yet';
  return `${formatShortDay(ukDayOf(scheduledFor))} ${ukDayOf(scheduledFor).slice(0, 4)}, ${ukTimeOf(scheduledFor)}`;
}

export function kindLabel(visit: Pick<ServiceVisit, 'kind'>): string {
  return VISIT_KIND_LABELS[visit.kind];
}

/** One line naming the visit, for link names and announcements. */
export function describeVisit(visit: ServiceVisit): string {
  const when = visit.scheduledFor
    ? `${ukTimeOf(visit.scheduledFor)} ${formatShortDay(ukDayOf(visit.scheduledFor))}`
    : `due ${formatCalendarDate(visit.dueDate)}`;
  return `${kindLabel(visit)} at ${visit.siteReference} ${visit.siteName}, ${when}`;
}

/** Still to be done and past its due date: said in words, not only by colour. */
export function isPastDue(visit: Pick<ServiceVisit, 'status' | 'dueDate'>, today: string): boolean {
  return visit.status === 'scheduled' && visit.dueDate < today;
}

export function daysOverdueWords(days: number): string {
  return days === 1 ? '1 day overdue' : `${days} days overdue`;
}

/** The id of a visit's link in the list or calendar, to hand focus back to when it closes. */
export const visitLinkId = (visitId: string, layout: 'list' | 'calendar') =>
  `visit-${layout}-${visitId}`;

/** Links within text and tables, marked as the sites list marks them: underlined in brass. */
export const inlineLinkClassName =
  'font-semibold text-ink underline decoration-brass decoration-2 underline-offset-2';
