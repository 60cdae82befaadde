import type { ServiceVisit } from '@server/service/schema';
import { Link } from 'react-router-dom';

import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import { formatCalendarDate } from '@/lib/dates';
import { VisitStatusWords } from '@/features/service/components/visit-status-words';
import { formatShortDay, ukTimeOf } from '@/features/service/utils/uk-calendar';
import {
  inlineLinkClassName,
  kindLabel,
  visitDay,
  visitLinkId,
} from '@/features/service/utils/visit-words';

type EngineerGroup = { key: string; name: string; visits: ServiceVisit[] };

/** One group per engineer, by name, with the visits nobody is sent on yet first: they need one. */
function groupByEngineer(visits: readonly ServiceVisit[]): EngineerGroup[] {
  const groups = new Map<string, EngineerGroup>();
  for (const visit of visits) {
    const key = visit.engineer?.id ?? 'unassigned';
    const group = groups.get(key) ?? {
      key,
      name: visit.engineer?.name ?? 'No engineer yet',
      visits: [],
    };
    group.visits.push(visit);
    groups.set(key, group);
  }
  return [...groups.values()].sort((a, b) =>
    a.key === 'unassigned' ? -1 : b.key === 'unassigned' ? 1 : a.name.localeCompare(b.name),
  );
}

type VisitsByEngineerProps = {
  visits: readonly ServiceVisit[];
  today: string;
  visitHref: (visitId: string) => string;
  selectedVisitId?: string;
};

export function VisitsByEngineer({
  visits,
  today,
  visitHref,
  selectedVisitId,
}: VisitsByEngineerProps) {
  const columns: DataTableColumn<ServiceVisit>[] = [
    {
      header: 'Day',
      cell: (visit) => (
        <span className="whitespace-nowrap">
          {formatShortDay(visitDay(visit))}
          {visit.scheduledFor ? (
            <span className="font-mono"> {ukTimeOf(visit.scheduledFor)}</span>
          ) : (
            <span className="text-ink-muted"> (no time yet)</span>
          )}
        </span>
      ),
    },
    {
      header: 'Site',
      isRowHeader: true,
      cell: (visit) => (
        <Link
          id={visitLinkId(visit.id, 'list')}
          to={visitHref(visit.id)}
          aria-current={visit.id === selectedVisitId ? 'true' : undefined}
          className={inlineLinkClassName}
        >
          <span className="font-mono">{visit.siteReference}</span> {visit.siteName}
        </Link>
      ),
    },
    { header: 'Town', cell: (visit) => visit.siteTown },
    { header: 'Kind', cell: (visit) => kindLabel(visit) },
    {
      header: 'Due',
      cell: (visit) => (
        <span className="whitespace-nowrap">{formatCalendarDate(visit.dueDate)}</span>
      ),
    },
    { header: 'Status', cell: (visit) => <VisitStatusWords visit={visit} today={today} /> },
  ];

  const groups = groupByEngineer(visits);
  if (groups.length === 0)
    return <p className="px-4 py-6 text-ink-muted md:px-5">No visits fall in this month.</p>;
  return (
    <div className="grid gap-6 py-4">
      {groups.map((group) => (
        <section key={group.key} aria-labelledby={`engineer-group-${group.key}`}>
          <h3 id={`engineer-group-${group.key}`} className="px-4 pb-2 font-semibold md:px-5">
            {group.name}{' '}
            <span className="font-normal text-ink-muted">
              ({group.visits.length === 1 ? '1 visit' : `${group.visits.length} visits`})
            </span>
          </h3>
          <DataTable
            caption={`Visits for ${group.name}`}
            columns={columns}
            rows={group.visits}
            rowKey={(visit) => visit.id}
            emptyMessage="No visits."
            dense
          />
        </section>
      ))}
    </div>
  );
}
