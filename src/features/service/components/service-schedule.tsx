import type { ServiceVisit } from '@server/service/schema';
import { useQueryClient } from '@tanstack/react-query';
import {
  CalendarDays,
  CalendarPlus,
  ChevronLeft,
  ChevronRight,
  List,
  RotateCw,
} from 'lucide-react';
import { useEffect, useRef, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';

import { Button } from '@/components/ui/button';
import { buttonClassName } from '@/components/ui/button-styles';
import { selectClassName } from '@/components/ui/form-styles';
import { LoadingStatus } from '@/components/ui/loading-status';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { paths, type SiteRole } from '@/config/paths';
import {
  getServiceScheduleQueryOptions,
  useServiceSchedule,
} from '@/features/service/api/get-service-schedule';
import { BookVisitForm } from '@/features/service/components/book-visit-form';
import type { EngineerChoice } from '@/features/service/components/move-visit-form';
import { FaultQueue } from '@/features/service/components/fault-queue';
import { OverdueList } from '@/features/service/components/overdue-list';
import { VisitCalendar } from '@/features/service/components/visit-calendar';
import { VisitDetail } from '@/features/service/components/visit-detail';
import { VisitsByEngineer } from '@/features/service/components/visits-by-engineer';
import {
  readScheduleView,
  scheduleRangeOf,
  scheduleSearchParams,
  type ScheduleLayout,
  type ScheduleView,
} from '@/features/service/utils/schedule-view';
import type { SiteChoice } from '@/features/service/utils/site-choice';
import { formatMonth, monthOf, shiftMonth, ukToday } from '@/features/service/utils/uk-calendar';
import {
  describeVisit,
  inlineLinkClassName,
  visitDay,
  visitLinkId,
} from '@/features/service/utils/visit-words';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import { cn } from '@/utils/cn';

const BOOK_BUTTON_ID = 'book-visit-button';

const layouts: ReadonlyArray<{ layout: ScheduleLayout; label: string; icon: typeof List }> = [
  { layout: 'list', label: 'List by engineer', icon: List },
  { layout: 'calendar', label: 'Month calendar', icon: CalendarDays },
];

type ServiceScheduleProps = {
  role: SiteRole;
  /** For an engineer: the schedule shows only their own visits, and changes nothing. */
  ownEngineerId?: string;
  /** The company's engineers, to filter by and to send (office only). */
  engineers: readonly EngineerChoice[];
  engineersError?: unknown;
  /** The site named by `?book=`, once its name is known. */
  bookSite?: SiteChoice;
};

/** The company's service visits by month: a list by engineer or a calendar, and one visit open. */
export function ServiceSchedule({
  role,
  ownEngineerId,
  engineers,
  engineersError,
  bookSite,
}: ServiceScheduleProps) {
  const queryClient = useQueryClient();
  const [today] = useState(() => ukToday());
  const [searchParams, setSearchParams] = useSearchParams();
  const view = readScheduleView(searchParams, today);
  const range = scheduleRangeOf(view, ownEngineerId);
  const schedule = useServiceSchedule(range);
  const isOffice = role === 'office';

  const hrefFor = (change: Partial<ScheduleView>) =>
    `?${scheduleSearchParams({ ...view, ...change }, today)}`;
  const show = (change: Partial<ScheduleView>) =>
    setSearchParams(scheduleSearchParams({ ...view, ...change }, today));

  // --- Booking (office) ---------------------------------------------------------------------
  const [isBooking, setIsBooking] = useState(Boolean(view.bookSiteId));
  const [bookedMessage, setBookedMessage] = useState('');
  const bookHeadingRef = useRef<HTMLHeadingElement>(null);
  const openBooking = () => {
    setBookedMessage('');
    setIsBooking(true);
  };
  // "Book" on the overdue list (or a site's plan) opens the form for that site.
  const [bookingFor, setBookingFor] = useState(view.bookSiteId);
  if (view.bookSiteId !== bookingFor) {
    setBookingFor(view.bookSiteId);
    if (view.bookSiteId) {
      setBookedMessage('');
      setIsBooking(true);
    }
  }
  useEffect(() => {
    if (isBooking) bookHeadingRef.current?.focus();
  }, [isBooking, view.bookSiteId]);

  const focusAfterRender = useFocusAfterRender();
  const closeBooking = () => {
    setIsBooking(false);
    // The form that had focus is gone: carry on from the button that opens it again.
    focusAfterRender(BOOK_BUTTON_ID);
    if (view.bookSiteId) show({ bookSiteId: undefined });
  };

  const showBooked = (visit: ServiceVisit) => {
    setIsBooking(false);
    setBookedMessage(`Booked: ${describeVisit(visit)}.`);
    show({
      bookSiteId: undefined,
      month: monthOf(visitDay(visit)),
      visitId: visit.id,
      // A filter on another engineer would hide the visit just booked.
      engineerId:
        view.engineerId && visit.engineer?.id !== view.engineerId ? undefined : view.engineerId,
    });
  };

  // --- The open visit -----------------------------------------------------------------------
  const visits = schedule.data?.visits ?? [];
  const selectedVisit = view.visitId
    ? visits.find((visit) => visit.id === view.visitId)
    : undefined;
  const [focusDetail, setFocusDetail] = useState(false);
  const previousVisitId = useRef(view.visitId);
  useEffect(() => {
    const previous = previousVisitId.current;
    previousVisitId.current = view.visitId;
    if (view.visitId && view.visitId !== previous) setFocusDetail(true);
    // Closing the details hands focus back to the visit they were opened from.
    if (!view.visitId && previous)
      document.getElementById(visitLinkId(previous, view.layout))?.focus();
  }, [view.visitId, view.layout]);

  const reloadVisit = async () => {
    const latest = await queryClient.fetchQuery({
      ...getServiceScheduleQueryOptions(range),
      staleTime: 0,
    });
    return latest.visits.find((visit) => visit.id === view.visitId);
  };

  // A visit moved to another month: follow it there, so it stays open.
  const followVisit = (visit: ServiceVisit) => {
    const month = monthOf(visitDay(visit));
    if (month !== view.month) show({ month });
  };

  const visitHref = (visitId: string) => hrefFor({ visitId });
  const monthLabel = formatMonth(view.month);

  return (
    <div className="grid gap-6">
      {isOffice ? (
        isBooking ? (
          <section
            aria-labelledby="book-visit-heading"
            className="rounded-lg border border-hairline bg-white px-4 py-4 md:px-5"
          >
            <h2
              id="book-visit-heading"
              ref={bookHeadingRef}
              tabIndex={-1}
              className="mb-4 text-lg font-semibold focus:outline-none"
            >
              Book a visit
            </h2>
            <BookVisitForm
              headingId="book-visit-heading"
              engineers={engineers}
              presetSite={bookSite}
              onBooked={showBooked}
              onCancel={closeBooking}
            />
          </section>
        ) : (
          <div className="flex flex-wrap items-center gap-4">
            <Button id={BOOK_BUTTON_ID} onClick={openBooking}>
              <CalendarPlus aria-hidden="true" className="size-4" />
              Book a visit
            </Button>
          </div>
        )
      ) : null}
      <div role="status">
        {bookedMessage ? <Notice tone="normal" title={bookedMessage} /> : null}
      </div>
      {engineersError ? (
        <Notice tone="fault" title="The company’s engineers could not be loaded">
          The schedule still shows every visit; filtering by engineer and sending one need the list.
          Reload the page to try again.
        </Notice>
      ) : null}

      <div
        className={cn(
          'grid items-start gap-6',
          view.visitId && 'xl:grid-cols-[minmax(0,1fr)_26rem]',
        )}
      >
        <section
          aria-labelledby="schedule-heading"
          className="min-w-0 overflow-hidden rounded-lg border border-hairline bg-white"
        >
          <div className="grid gap-3 border-b border-hairline px-4 py-3 md:px-5">
            <div className="flex flex-wrap items-center gap-3">
              <h2 id="schedule-heading" className="text-lg font-semibold">
                {isOffice ? `Visits in ${monthLabel}` : `Your visits in ${monthLabel}`}
              </h2>
              <nav aria-label="Months" className="ml-auto flex flex-wrap gap-2">
                <Link
                  to={hrefFor({ month: shiftMonth(view.month, -1), visitId: undefined })}
                  className={buttonClassName({ variant: 'secondary' })}
                >
                  <ChevronLeft aria-hidden="true" className="size-4" />
                  Previous
                  <span className="sr-only"> month, {formatMonth(shiftMonth(view.month, -1))}</span>
                </Link>
                <Link
                  to={hrefFor({ month: monthOf(today), visitId: undefined })}
                  aria-current={view.month === monthOf(today) ? 'page' : undefined}
                  className={buttonClassName({ variant: 'secondary' })}
                >
                  This month
                </Link>
                <Link
                  to={hrefFor({ month: shiftMonth(view.month, 1), visitId: undefined })}
                  className={buttonClassName({ variant: 'secondary' })}
                >
                  Next
                  <span className="sr-only"> month, {formatMonth(shiftMonth(view.month, 1))}</span>
                  <ChevronRight aria-hidden="true" className="size-4" />
                </Link>
              </nav>
            </div>
            <div className="flex flex-wrap items-end gap-4">
              {isOffice ? (
                <div>
                  <label htmlFor="schedule-engineer" className="mb-1 block text-sm font-medium">
                    Show visits for
                  </label>
                  <select
                    id="schedule-engineer"
                    value={view.engineerId ?? ''}
                    onChange={(event) =>
                      show({ engineerId: event.target.value || undefined, visitId: undefined })
                    }
                    className={selectClassName({ className: 'min-w-56' })}
                  >
                    <option value="">All engineers</option>
                    {engineers.map((engineer) => (
                      <option key={engineer.id} value={engineer.id}>
                        {engineer.displayName}
                      </option>
                    ))}
                  </select>
                </div>
              ) : null}
              <nav aria-label="Schedule views">
                <ul className="flex gap-1 border-b border-hairline">
                  {layouts.map((item) => {
                    const isCurrent = item.layout === view.layout;
                    return (
                      <li key={item.layout}>
                        <Link
                          to={hrefFor({ layout: item.layout })}
                          aria-current={isCurrent ? 'page' : undefined}
                          className={cn(
                            '-mb-px flex min-h-11 items-center gap-2 border-b-4 px-3 text-sm font-semibold no-underline',
                            isCurrent
                              ? 'border-brass text-ink'
                              : 'border-transparent text-ink-muted hover:border-hairline hover:text-ink',
                          )}
                        >
                          <item.icon aria-hidden="true" className="size-4 shrink-0" />
                          {item.label}
                        </Link>
                      </li>
                    );
                  })}
                </ul>
              </nav>
            </div>
          </div>
          {schedule.isPending || schedule.isPlaceholderData ? (
            <LoadingStatus label={`Loading ${monthLabel}`} className="px-4 py-6 md:px-5" />
          ) : schedule.isError ? (
            <div className="p-4 md:p-5">
              <ProblemAlert
                error={schedule.error}
                title="The schedule could not be loaded."
                action={
                  <Button variant="secondary" onClick={() => void schedule.refetch()}>
                    <RotateCw aria-hidden="true" className="size-4" />
                    Try again
                  </Button>
                }
              />
            </div>
          ) : view.layout === 'calendar' ? (
            <VisitCalendar
              month={view.month}
              visits={visits}
              today={today}
              visitHref={visitHref}
              selectedVisitId={view.visitId}
            />
          ) : (
            <VisitsByEngineer
              visits={visits}
              today={today}
              visitHref={visitHref}
              selectedVisitId={view.visitId}
            />
          )}
        </section>

        {view.visitId ? (
          <aside aria-label="The open visit" className="min-w-0">
            {selectedVisit ? (
              <VisitDetail
                visit={selectedVisit}
                role={role}
                engineers={engineers}
                today={today}
                closeHref={hrefFor({ visitId: undefined })}
                takeFocus={focusDetail}
                reloadVisit={reloadVisit}
                onChanged={followVisit}
              />
            ) : schedule.isPending || schedule.isPlaceholderData ? (
              <LoadingStatus label="Loading the visit" />
            ) : (
              <Notice tone="info" title="This visit is not in the month shown">
                <p>
                  It may have been moved, or it falls on another engineer’s list.{' '}
                  <Link
                    to={hrefFor({ visitId: undefined, engineerId: undefined })}
                    className={inlineLinkClassName}
                  >
                    Show every engineer
                  </Link>{' '}
                  or choose another month.
                </p>
              </Notice>
            )}
          </aside>
        ) : null}
      </div>

      {isOffice ? (
        <OverdueList
          headingId="overdue-heading"
          bookHref={(siteId) => hrefFor({ bookSiteId: siteId })}
          siteHref={(siteId) => paths.sites.workspace.getHref(role, siteId)}
        />
      ) : null}
      {isOffice ? <FaultQueue headingId="faults-heading" /> : null}
    </div>
  );
}
