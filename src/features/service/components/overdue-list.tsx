import type { overdueSiteSchema } from '@server/service/schema';
import { CalendarPlus, RotateCw, TriangleAlert } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { z } from 'zod';

import { Button } from '@/components/ui/button';
import { buttonClassName } from '@/components/ui/button-styles';
import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import { LoadingStatus } from '@/components/ui/loading-status';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { formatCalendarDate } from '@/lib/dates';
import { useOverdueSites } from '@/features/service/api/get-overdue-sites';
import {
  daysOverdueWords,
  describeBooking,
  inlineLinkClassName,
} from '@/features/service/utils/visit-words';

type OverdueSite = z.infer<typeof overdueSiteSchema>;

function bookedWords(site: OverdueSite): string {
  const booked = site.bookedVisit;
  if (!booked) return 'Not booked';
  const engineer = booked.engineerName ? ` with ${booked.engineerName}` : '';
  return booked.scheduledFor
    ? `${describeBooking(booked.scheduledFor)}${engineer}`
    : `Planned, no day yet${engineer}`;
}

type OverdueListProps = {
  headingId: string;
  /** Opens the booking form for the site. */
  bookHref: (siteId: string) => string;
  siteHref: (siteId: string) => string;
};

/**
 * The company's sites whose preventive visit is past due, the longest overdue first, with the
 * plan's rule and its source exactly as the API gives them.
 */
export function OverdueList({ headingId, bookHref, siteHref }: OverdueListProps) {
  const overdue = useOverdueSites();

  const columns: DataTableColumn<OverdueSite>[] = [
    {
      header: 'Site',
      isRowHeader: true,
      cell: (site) => (
        <Link to={siteHref(site.siteId)} className={inlineLinkClassName}>
          <span className="font-mono">{site.siteReference}</span> {site.siteName}
        </Link>
      ),
    },
    { header: 'Town', cell: (site) => site.siteTown },
    {
      header: 'Overdue',
      cell: (site) => (
        <span className="inline-flex items-center gap-1 font-semibold whitespace-nowrap text-fault-text">
          <TriangleAlert aria-hidden="true" className="size-4 shrink-0" />
          {daysOverdueWords(site.daysOverdue)}
        </span>
      ),
    },
    {
      header: 'Was due',
      cell: (site) => (
        <span className="whitespace-nowrap">{formatCalendarDate(site.nextDueOn)}</span>
      ),
    },
    {
      header: 'Last preventive visit',
      cell: (site) =>
        site.lastPreventiveVisitOn
          ? formatCalendarDate(site.lastPreventiveVisitOn)
          : 'None recorded',
    },
    {
      header: 'Plan',
      cell: (site) => (site.visitsPerYear === 1 ? '1 a year' : `${site.visitsPerYear} a year`),
    },
    { header: 'Booked', cell: bookedWords },
    {
      header: 'Action',
      cell: (site) =>
        site.bookedVisit ? null : (
          <Link
            to={bookHref(site.siteId)}
            className={buttonClassName({ variant: 'secondary', className: 'whitespace-nowrap' })}
          >
            <CalendarPlus aria-hidden="true" className="size-4" />
            Book<span className="sr-only"> a visit for {site.siteName}</span>
          </Link>
        ),
    },
  ];

  return (
    <section
      aria-labelledby={headingId}
      className="overflow-hidden rounded-lg border border-hairline bg-white"
    >
      <div className="border-b border-hairline px-4 py-3 md:px-5">
        <h2 id={headingId} className="text-lg font-semibold">
          Overdue preventive visits
        </h2>
        {overdue.data ? (
          <p className="text-sm text-ink-muted">
            Plan rule: {overdue.data.rule} ({overdue.data.source}). Counted to{' '}
            {formatCalendarDate(overdue.data.today)}.
          </p>
        ) : null}
      </div>
      {overdue.isPending ? (
        <LoadingStatus label="Loading overdue sites" className="px-4 py-4 md:px-5" />
      ) : overdue.isError ? (
        <div className="p-4 md:p-5">
          <ProblemAlert
            error={overdue.error}
            title="The overdue list could not be loaded."
            action={
              <Button variant="secondary" onClick={() => void overdue.refetch()}>
                <RotateCw aria-hidden="true" className="size-4" />
                Try again
              </Button>
            }
          />
        </div>
      ) : (
        <DataTable
          caption="Sites with a preventive visit overdue"
          columns={columns}
          rows={overdue.data.sites}
          rowKey={(site) => site.siteId}
          emptyMessage="No site is overdue for its preventive visit."
          dense
        />
      )}
    </section>
  );
}
