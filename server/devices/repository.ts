import type { Knex } from 'knex';
import type { Device } from './schema';

const decimal = (value: string | null) => (value === null ? null : Number(value));

export async function listDevices(db: Knex, systemId: string): Promise<Device[]> {
  const rows = await db('devices').where({ system_id: systemId }).orderBy('position');
  return rows.map((row) => ({
    id: row.id,
    position: row.position,
    kind: row.kind,
    location: row.location,
    model: row.model,
    areaId: row.area_id,
    grade: row.grade,
    environmentalClass: row.environmental_class,
    quiescentMa: decimal(row.quiescent_ma),
    alarmMa: decimal(row.alarm_ma),
  }));
}
