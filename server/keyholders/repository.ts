import type { Knex } from 'knex';
import type { Keyholder } from './schema';

export interface KeyholderRow {
  id: string;
  site_id: string;
  call_order: number;
  name: string;
  phone: string;
  email: string | null;
  relation: string;
  minutes_to_attend: number;
  unavailable: { from: string; to: string; note: string }[];
  last_confirmed_at: Date | null;
  user_id: string | null;
  version: number;
}

export const toKeyholder = (row: KeyholderRow): Keyholder => ({
  id: row.id,
  callOrder: row.call_order,
  name: row.name,
  phone: row.phone,
  email: row.email,
  relation: row.relation,
  minutesToAttend: row.minutes_to_attend,
  unavailable: row.unavailable,
  lastConfirmedAt: row.last_confirmed_at?.toISOString() ?? null,
  hasAccount: row.user_id !== null,
  version: row.version,
});

export async function listKeyholders(db: Knex, siteId: string): Promise<Keyholder[]> {
  const rows = await db<KeyholderRow>('keyholders')
    .where({ site_id: siteId })
    .orderBy('call_order');
  return rows.map(toKeyholder);
}

export function findKeyholder(db: Knex, siteId: string, keyholderId: string) {
  return db<KeyholderRow>('keyholders').where({ site_id: siteId, id: keyholderId }).first();
}

/** Closes the gap a removal leaves: the call order stays 1, 2, 3, … */
export async function renumberCallOrder(trx: Knex.Transaction, siteId: string) {
  await trx.raw(
    `update keyholders k set call_order = ranked.n
       from (select id, row_number() over (order by call_order) as n from keyholders where site_id = ?) ranked
      where k.id = ranked.id and k.call_order <> ranked.n`,
    [siteId],
  );
}

const FIELD_COLUMNS = {
  name: 'name',
  phone: 'phone',
  email: 'email',
  relation: 'relation',
  minutesToAttend: 'minutes_to_attend',
  unavailable: 'unavailable',
} as const;

export function keyholderColumns(values: Partial<Record<keyof typeof FIELD_COLUMNS, unknown>>) {
  const columns: Record<string, unknown> = {};
  for (const [field, column] of Object.entries(FIELD_COLUMNS)) {
    const value = values[field as keyof typeof FIELD_COLUMNS];
    if (value === undefined) continue;
    columns[column] = field === 'unavailable' ? JSON.stringify(value) : value;
  }
  return columns;
}
