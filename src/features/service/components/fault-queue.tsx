import type { QueuedFault } from '@server/faults/schema';
import { CalendarPlus, RotateCw } from 'lucide-react';
import { useRef } from 'react';

import { Button } from '@/components/ui/button';
import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import { LoadingStatus } from '@/components/ui/loading-status';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { formatDateTime } from '@/utils/format';
import { useBookCallout } from '@/features/service/api/book-callout';
import { useFaultQueue } from '@/features/service/api/get-fault-queue';

/**
 * Faults homeowners reported, newest first, each with the call-out booked from it or a button
 * to book one for today (the office then assigns and moves it like any visit).
 */
export function FaultQueue({ headingId }: { headingId: string }) {
  const faults = useFaultQueue();
  const bookCallout = useBookCallout();
  // One key per report for the life of the page: pressing twice, or a resend, books once.
  const keys = useRef(new Map<string, string>());
  const keyFor = (reportId: string) => {
    if (!keys.current.has(reportId)) keys.current.set(reportId, crypto.randomUUID());
    return keys.current.get(reportId)!;
  };

  const columns: DataTableColumn<QueuedFault>[] = [
    {
      header: 'Site',
      isRowHeader: true,
      cell: (fault) => (
        <span>
          <span className="font-mono">{fault.siteReference}</span> {fault.siteName},{' '}
          {fault.siteTown}
        </span>
      ),
    },
    {
      header: 'Reported',
      cell: (fault) => (
        <span className="whitespace-nowrap">
          {formatDateTime(fault.reportedAt)}
          {fault.reportedBy ? (
            <span className="block text-ink-muted">{fault.reportedBy.name}</span>
          ) : null}
        </span>
      ),
    },
    {
      header: 'Fault',
      cell: (fault) => (
        <span className="whitespace-pre-line">
          {fault.description}
          {fault.photos.length > 0 ? (
            <span className="block text-sm text-ink-muted">
              {fault.photos.length} photo{fault.photos.length === 1 ? '' : 's'}
            </span>
          ) : null}
        </span>
      ),
    },
    { header: 'Where it is', cell: (fault) => fault.statusWords },
    {
      header: 'Action',
      cell: (fault) =>
        fault.visit || fault.status !== 'open' ? null : (
          <Button
            variant="secondary"
            disabled={bookCallout.isPending}
            onClick={() =>
              bookCallout.mutate({
                siteId: fault.siteId,
                faultReportId: fault.id,
                clientKey: keyFor(fault.id),
              })
            }
          >
            <CalendarPlus aria-hidden="true" className="size-4" />
            Book a call-out<span className="sr-only"> for {fault.siteName}</span>
          </Button>
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
          Faults reported by homeowners
        </h2>
      </div>
      {bookCallout.isError ? (
        <div className="p-4 md:p-5">
          <ProblemAlert error={bookCallout.error} title="The call-out was not booked." />
        </div>
      ) : null}
      {faults.isPending ? (
        <LoadingStatus label="Loading fault reports" className="px-4 py-4 md:px-5" />
      ) : faults.isError ? (
        <div className="p-4 md:p-5">
          <ProblemAlert
            error={faults.error}
            title="The fault reports could not be loaded."
            action={
              <Button variant="secondary" onClick={() => void faults.refetch()}>
                <RotateCw aria-hidden="true" className="size-4" />
                Try again
              </Button>
            }
          />
        </div>
      ) : (
        <DataTable
          caption="Faults reported by homeowners"
          columns={columns}
          rows={faults.data.faults}
          rowKey={(fault) => fault.id}
          emptyMessage="No homeowner has reported a fault."
          dense
        />
      )}
    </section>
  );
}
