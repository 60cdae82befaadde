import type { Knex } from 'knex';
import { ConflictError, NotFoundError } from './errors';

/**
 * Optimistic concurrency: the row changes only if it is still at the version the person
 * edited; otherwise nothing is written and they are told to reload.
 */
export async function updateAtVersion<Row>(
  trx: Knex,
  table: string,
  where: Record<string, unknown>,
  version: number,
  patch: Record<string, unknown>,
  versionColumn = 'version',
): Promise<Row> {
  const [row] = await trx(table)
    .where(where)
    .andWhere(versionColumn, version)
    .update({ ...patch, [versionColumn]: trx.raw('?? + 1', [versionColumn]) })
    .returning('*');
  if (row) return row as Row;
  const exists = await trx(table).where(where).first(versionColumn);
  if (!exists) throw new NotFoundError();
  throw new ConflictError(
    'Someone else saved a change since you opened this. Reload to see it; your edits are still in the form.',
  );
}

/** Field-level differences for the audit log; unchanged fields and bookkeeping are left out. */
export function changedFields(
  before: Record<string, unknown>,
  after: Record<string, unknown>,
  ignore: string[] = ['version', 'updated_at', 'created_at', 'search_text'],
): Record<string, { from: unknown; to: unknown }> {
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  for (const key of Object.keys(after)) {
    if (ignore.includes(key)) continue;
    const from = before[key];
    const to = after[key];
    if (JSON.stringify(from) !== JSON.stringify(to)) changes[key] = { from, to };
  }
  return changes;
}
