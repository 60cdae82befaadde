import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import type { AuditEntry } from '@/features/homes/api/get-role-home';
import { formatDateTime } from '@/utils/format';

const columns: DataTableColumn<AuditEntry>[] = [
  {
    header: 'When',
    cell: (entry) => <time dateTime={entry.occurredAt}>{formatDateTime(entry.occurredAt)}</time>,
    className: 'whitespace-nowrap',
  },
  // Changes made by Wardbook itself (reminders, escalations) have no person behind them.
  { header: 'Who', cell: (entry) => entry.actorName ?? 'Wardbook (automatic)' },
  {
    header: 'Action',
    cell: (entry) => <span className="font-mono text-xs">{entry.action}</span>,
    className: 'whitespace-nowrap',
  },
  { header: 'What happened', cell: (entry) => entry.summary },
];

type AuditTableProps = { entries: readonly AuditEntry[] };

export function AuditTable({ entries }: AuditTableProps) {
  return (
    <DataTable
      caption="Recent changes in the audit log"
      columns={columns}
      rows={entries}
      rowKey={(entry) => entry.id}
      emptyMessage="Nothing has been recorded yet."
      dense
    />
  );
}
