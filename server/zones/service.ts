import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { ConflictError } from '../http/errors';
import { updateAtVersion } from '../http/versioned-update';
import type { SiteAccess } from '../sites/access';
import { saveOrderedRows } from '../systems/ordered-rows';
import { findSystemRow, listAreas, type SystemRow } from '../systems/repository';
import { listZones } from './repository';
import type { saveZonesSchema, ZoneSchedule } from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;
type ZoneInput = z.output<typeof saveZonesSchema>['zones'][number];

export async function getZoneSchedule(db: Knex, siteId: string): Promise<ZoneSchedule> {
  const system = await findSystemRow(db, siteId);
  if (!system) return { zonesVersion: null, areas: [], zones: [] };
  const [areas, zones] = await Promise.all([listAreas(db, system.id), listZones(db, system.id)]);
  return { zonesVersion: system.zones_version, areas, zones };
}

const zoneColumns = (zone: ZoneInput) => ({
  number: zone.number,
  location: zone.location,
  zone_type: zone.zoneType,
  detector_kind: zone.detectorKind,
  detector_model: zone.detectorModel,
  loop_wiring: zone.loopWiring,
  tamper_ohms: zone.tamperOhms,
  alarm_ohms: zone.alarmOhms,
  core_map: JSON.stringify(zone.coreMap),
  cable_metres: zone.cableMetres,
  cores_per_leg: zone.coresPerLeg,
  area_id: zone.areaId,
  attributes: zone.attributes,
  grade: zone.grade,
  environmental_class: zone.environmentalClass,
  quiescent_ma: zone.quiescentMa,
  alarm_ma: zone.alarmMa,
});

/** Saves the whole schedule at once, or nothing if anyone else saved it first. */
export async function saveZoneSchedule(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof saveZonesSchema>,
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const system = await findSystemRow(trx, access.id);
    if (!system)
      throw new ConflictError('Record the control panel on the System tab before adding zones.');
    await updateAtVersion<SystemRow>(
      trx,
      'systems',
      { id: system.id },
      input.zonesVersion,
      { updated_at: trx.fn.now() },
      'zones_version',
    );
    const counts = await saveOrderedRows(trx, {
      table: 'zones',
      systemId: system.id,
      listName: 'zones',
      rows: input.zones,
      toColumns: zoneColumns,
    });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'zones.saved',
      entityType: 'system',
      entityId: system.id,
      organisationId: access.installerId,
      summary: `Saved the zone schedule: ${input.zones.length} zone(s), ${counts.inserted} added, ${counts.deleted} removed`,
      changes: { zones: { to: input.zones.map((zone) => `${zone.number} ${zone.location}`) } },
    });
  });
  return getZoneSchedule(db, access.id);
}
