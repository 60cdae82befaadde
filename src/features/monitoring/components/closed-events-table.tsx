import type { AlarmEvent } from '@server/monitoring/schema';
import { Link } from 'react-router-dom';

import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import { paths } from '@/config/paths';
import { categoryLabel, eventLabel, outcomeLabel } from '@/utils/alarm-words';
import { formatDateTime } from '@/utils/format';

const columns: DataTableColumn<AlarmEvent>[] = [
  {
    header: 'Event',
    isRowHeader: true,
    cell: (event) => (
      <Link
        to={paths.monitoringEvent.getHref(event.id)}
        aria-label={`${categoryLabel(event.category)} at ${event.siteName ?? `account ${event.account}`}, closed`}
      >
        {eventLabel(event.category, event.confirmed)}
      </Link>
    ),
  },
  {
    header: 'Site',
    cell: (event) => (
      <>
        <span className="block">{event.siteName ?? `Unknown account ${event.account}`}</span>
        <span className="block font-mono text-xs text-ink-muted">account {event.account}</span>
      </>
    ),
  },
  {
    header: 'Raised',
    className: 'whitespace-nowrap',
    cell: (event) => (
      <time dateTime={event.firstSignalAt}>{formatDateTime(event.firstSignalAt)}</time>
    ),
  },
  {
    header: 'Closed',
    className: 'whitespace-nowrap',
    cell: (event) =>
      event.closedAt ? (
        <time dateTime={event.closedAt}>{formatDateTime(event.closedAt)}</time>
      ) : (
        '–'
      ),
  },
  { header: 'Outcome', cell: (event) => outcomeLabel(event.outcome) },
  { header: 'Handled by', cell: (event) => event.takenBy ?? '–' },
];

/** The most recently closed events, newest first. */
export function ClosedEventsTable({ events }: { events: readonly AlarmEvent[] }) {
  return (
    <DataTable
      caption="Recently closed events, newest first"
      columns={columns}
      rows={events}
      rowKey={(event) => event.id}
      emptyMessage="No events have been closed yet."
      dense
    />
  );
}
