import type { Knex } from 'knex';
import type { WalkTest } from './schema';

interface WalkTestRow {
  id: string;
  zone_id: string;
  secure_reading_ohms: string | null;
  secure_open: boolean;
  secure_state: WalkTest['secureState'];
  alarm_reading_ohms: string | null;
  alarm_open: boolean;
  alarm_state: WalkTest['alarmState'];
  activated: boolean;
  passed: boolean;
  note: string;
  tested_by_name: string | null;
  tested_at: Date;
  failures: string[];
}

const ohms = (value: string | null, open: boolean) =>
  open ? null : value === null ? null : Number(value);

export function toWalkTest(row: WalkTestRow): WalkTest {
  return {
    id: row.id,
    zoneId: row.zone_id,
    secureReadingOhms: ohms(row.secure_reading_ohms, row.secure_open),
    secureState: row.secure_state,
    alarmReadingOhms: ohms(row.alarm_reading_ohms, row.alarm_open),
    alarmState: row.alarm_state,
    activated: row.activated,
    passed: row.passed,
    failures: row.failures,
    note: row.note,
    testedBy: row.tested_by_name,
    testedAt: row.tested_at.toISOString(),
  };
}

/** The newest walk test of each zone of a system, in one query. */
export function latestWalkTests(db: Knex, systemId: string) {
  return db
    .select('w.*', 'u.display_name as tested_by_name')
    .from(
      db.raw(
        '(select distinct on (zone_id) * from walk_tests where zone_id in (select id from zones where system_id = ?) order by zone_id, tested_at desc, recorded_at desc) as w',
        [systemId],
      ),
    )
    .leftJoin('users as u', 'u.id', 'w.tested_by') as unknown as Promise<WalkTestRow[]>;
}

export function findWalkTestByKey(db: Knex, clientKey: string) {
  return db('walk_tests as w')
    .leftJoin('users as u', 'u.id', 'w.tested_by')
    .where('w.client_key', clientKey)
    .first<WalkTestRow | undefined>('w.*', 'u.display_name as tested_by_name');
}

export interface SitingRow {
  zone_id: string;
  answers: Record<string, boolean>;
  all_clear: boolean;
  checked_at: Date;
}

export function latestSitingChecks(db: Knex, systemId: string) {
  return db
    .select('*')
    .from(
      db.raw(
        '(select distinct on (zone_id) * from siting_checks where zone_id in (select id from zones where system_id = ?) order by zone_id, checked_at desc) as s',
        [systemId],
      ),
    ) as unknown as Promise<SitingRow[]>;
}

export interface SystemTestRow {
  id: string;
  kind: 'sounders' | 'signalling' | 'battery';
  passed: boolean;
  details: Record<string, unknown>;
  tested_at: Date;
  tested_by_name: string | null;
}

export function latestSystemTests(db: Knex, systemId: string) {
  return db
    .select('t.*', 'u.display_name as tested_by_name')
    .from(
      db.raw(
        '(select distinct on (kind) * from system_tests where system_id = ? order by kind, tested_at desc, recorded_at desc) as t',
        [systemId],
      ),
    )
    .leftJoin('users as u', 'u.id', 't.tested_by') as unknown as Promise<SystemTestRow[]>;
}

export type { WalkTestRow };
