import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import { describeRole } from '@/lib/roles';
import type { Person } from '@/types/api';

const columns: DataTableColumn<Person>[] = [
  { header: 'Name', cell: (person) => person.displayName, isRowHeader: true },
  { header: 'E-mail', cell: (person) => person.email, className: 'break-all' },
  {
    header: 'Roles',
    cell: (person) => person.roles.map(describeRole).join(', ') || 'None',
  },
];

type PeopleTableProps = {
  caption: string;
  people: readonly Person[];
  emptyMessage: string;
  dense?: boolean;
};

export function PeopleTable({ caption, people, emptyMessage, dense }: PeopleTableProps) {
  return (
    <DataTable
      caption={caption}
      columns={columns}
      rows={people}
      rowKey={(person) => person.id}
      emptyMessage={emptyMessage}
      dense={dense}
    />
  );
}
