import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { ConflictError, ValidationError } from '../http/errors';
import { changedFields, updateAtVersion } from '../http/versioned-update';
import type { SiteAccess } from '../sites/access';
import { findSystemRow, getSystemRecord, type SystemRow } from './repository';
import type { saveSystemSchema } from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

/**
 * Records or updates the panel, power supply, signalling paths and areas in one transaction.
 * Areas keep their ids (zones and devices point at them); paths are rewritten in order.
 */
export async function saveSystem(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof saveSystemSchema>,
  actor: Actor,
) {
  const { version, signallingPaths, areas, ...fields } = input;
  const columns = {
    control_panel: fields.controlPanel,
    firmware: fields.firmware,
    panel_location: fields.panelLocation,
    psu_type: fields.psuType,
    battery_ah: fields.batteryAh,
    notification: fields.notification,
    mains_failure_signalled: fields.mainsFailureSignalled,
    panel_grade: fields.panelGrade,
    panel_quiescent_ma: fields.panelQuiescentMa,
    panel_alarm_ma: fields.panelAlarmMa,
    sounder_minutes: fields.sounderMinutes,
    standby_hours_override: fields.standbyHoursOverride,
    resistor_tolerance: fields.resistorTolerance,
    cable_core: fields.cableCore,
    supply_volts: fields.supplyVolts,
  };

  await db.transaction(async (trx) => {
    const before = await findSystemRow(trx, access.id);
    let system: SystemRow;
    if (!before) {
      if (version !== null) throw new ConflictError('This system was removed; reload the page.');
      [system] = await trx('systems')
        .insert({ ...columns, site_id: access.id })
        .returning('*');
    } else {
      if (version === null) {
        throw new ConflictError(
          'Someone recorded this system while you were editing. Reload to see it.',
        );
      }
      system = await updateAtVersion<SystemRow>(trx, 'systems', { id: before.id }, version, {
        ...columns,
        updated_at: trx.fn.now(),
      });
    }

    const existingAreaIds = await trx('areas').where({ system_id: system.id }).pluck('id');
    const foreign = areas.findIndex((area) => area.id && !existingAreaIds.includes(area.id));
    if (foreign >= 0) {
      throw new ValidationError([
        { path: `body.areas.${foreign}.id`, message: 'This area belongs to another system.' },
      ]);
    }
    const keptIds = areas.flatMap((area) => (area.id ? [area.id] : []));
    await trx('areas').where({ system_id: system.id }).whereNotIn('id', keptIds).delete();
    for (const area of areas) {
      if (area.id)
        await trx('areas').where({ id: area.id }).update({ number: area.number, name: area.name });
      else
        await trx('areas').insert({ system_id: system.id, number: area.number, name: area.name });
    }

    await trx('signalling_paths').where({ system_id: system.id }).delete();
    if (signallingPaths.length) {
      await trx('signalling_paths').insert(
        signallingPaths.map((path, index) => ({
          system_id: system.id,
          position: index + 1,
          bearer: path.bearer,
          ats_category: path.atsCategory,
          description: path.description,
          to_monitoring_centre: path.toMonitoringCentre,
        })),
      );
    }

    await recordAuditEntry(trx, {
      ...actor,
      action: before ? 'system.updated' : 'system.created',
      entityType: 'system',
      entityId: system.id,
      organisationId: access.installerId,
      summary: before ? 'Updated the panel, power and signalling record' : 'Recorded the system',
      changes: {
        ...changedFields(
          (before ?? {}) as Record<string, unknown>,
          system as unknown as Record<string, unknown>,
          [
            'version',
            'zones_version',
            'devices_version',
            'updated_at',
            'created_at',
            'id',
            'site_id',
          ],
        ),
        areas: { from: existingAreaIds.length, to: areas.length },
        signallingPaths: {
          to: signallingPaths.map((path) => `${path.bearer} ${path.atsCategory}`.trim()),
        },
      },
    });
  });
  return getSystemRecord(db, access.id);
}
