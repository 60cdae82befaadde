import type { Knex } from 'knex';
import type { Zone } from './schema';

const decimal = (value: string | null) => (value === null ? null : Number(value));

export async function listZones(db: Knex, systemId: string): Promise<Zone[]> {
  const rows = await db('zones').where({ system_id: systemId }).orderBy('position');
  return rows.map((row) => ({
    id: row.id,
    position: row.position,
    number: row.number,
    location: row.location,
    zoneType: row.zone_type,
    detectorKind: row.detector_kind,
    detectorModel: row.detector_model,
    loopWiring: row.loop_wiring,
    tamperOhms: row.tamper_ohms,
    alarmOhms: row.alarm_ohms,
    coreMap: row.core_map,
    cableMetres: decimal(row.cable_metres),
    coresPerLeg: row.cores_per_leg,
    areaId: row.area_id,
    attributes: row.attributes,
    grade: row.grade,
    environmentalClass: row.environmental_class,
    quiescentMa: decimal(row.quiescent_ma),
    alarmMa: decimal(row.alarm_ma),
  }));
}
