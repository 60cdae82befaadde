import type { Knex } from 'knex';
import { ValidationError } from '../http/errors';

/**
 * Saves a whole ordered list (the zone schedule, the device list) against what is stored:
 * rows sent back with their id are updated in place, so their identity and history survive;
 * new rows are inserted; rows left out are deleted. Array order becomes `position`.
 */
export async function saveOrderedRows<Row extends { id?: string; areaId?: string | null }>(
  trx: Knex.Transaction,
  options: {
    table: string;
    systemId: string;
    listName: string;
    rows: Row[];
    toColumns: (row: Row) => Record<string, unknown>;
  },
): Promise<{ inserted: number; updated: number; deleted: number }> {
  const { table, systemId, rows, listName } = options;
  const existingIds = new Set<string>(await trx(table).where({ system_id: systemId }).pluck('id'));
  const areaIds = new Set<string>(await trx('areas').where({ system_id: systemId }).pluck('id'));
  const problems = rows.flatMap((row, index) => [
    ...(row.id && !existingIds.has(row.id)
      ? [
          {
            path: `body.${listName}.${index}.id`,
            message: 'This row no longer exists; reload to see the latest.',
          },
        ]
      : []),
    ...(row.areaId && !areaIds.has(row.areaId)
      ? [
          {
            path: `body.${listName}.${index}.areaId`,
            message: 'Choose one of this system’s areas.',
          },
        ]
      : []),
  ]);
  if (problems.length) throw new ValidationError(problems);

  const keptIds = rows.flatMap((row) => (row.id ? [row.id] : []));
  const deleted = await trx(table)
    .where({ system_id: systemId })
    .whereNotIn('id', keptIds)
    .delete();
  let inserted = 0;
  let updated = 0;
  for (const [index, row] of rows.entries()) {
    const columns = { ...options.toColumns(row), position: index + 1 };
    if (row.id) {
      await trx(table).where({ id: row.id }).update(columns);
      updated++;
    } else {
      await trx(table).insert({ ...columns, system_id: systemId });
      inserted++;
    }
  }
  return { inserted, updated, deleted };
}
