import type { Knex } from 'knex';
import type { UserSlot } from './schema';

export interface UserSlotRow {
  id: string;
  site_id: string;
  slot: number;
  holder_name: string;
  access_level: number;
  area_numbers: number[];
  valid_from: string | null;
  valid_to: string | null;
  active: boolean;
  changed_by: string | null;
  changed_at: Date;
  version: number;
}

// Dates stay calendar dates: no time zone can move a "valid to" day.
export function toUserSlot(row: UserSlotRow & { changed_by_name?: string | null }): UserSlot {
  return {
    id: row.id,
    slot: row.slot,
    holderName: row.holder_name,
    accessLevel: row.access_level,
    areaNumbers: row.area_numbers,
    validFrom: row.valid_from,
    validTo: row.valid_to,
    active: row.active,
    changedBy: row.changed_by_name ?? null,
    changedAt: row.changed_at.toISOString(),
    version: row.version,
  };
}

export function slotsQuery(db: Knex, siteId: string) {
  return db('user_code_slots as c')
    .leftJoin('users as u', 'u.id', 'c.changed_by')
    .where('c.site_id', siteId)
    .select('c.*', 'u.display_name as changed_by_name');
}

export async function listUserSlots(db: Knex, siteId: string) {
  const rows = await slotsQuery(db, siteId).orderBy('c.slot');
  return rows.map(toUserSlot);
}

export async function findUserSlot(db: Knex, siteId: string, slotId: string) {
  const row = await slotsQuery(db, siteId).where('c.id', slotId).first();
  return row ? toUserSlot(row) : undefined;
}

const FIELD_COLUMNS = {
  holderName: 'holder_name',
  accessLevel: 'access_level',
  areaNumbers: 'area_numbers',
  validFrom: 'valid_from',
  validTo: 'valid_to',
  active: 'active',
} as const;

export function slotColumns(values: Partial<Record<keyof typeof FIELD_COLUMNS, unknown>>) {
  const columns: Record<string, unknown> = {};
  for (const [field, column] of Object.entries(FIELD_COLUMNS)) {
    const value = values[field as keyof typeof FIELD_COLUMNS];
    if (value !== undefined) columns[column] = value;
  }
  return columns;
}
