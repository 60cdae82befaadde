import type { Knex } from 'knex';
import type { z } from 'zod';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { ConflictError } from '../http/errors';
import { updateAtVersion } from '../http/versioned-update';
import type { SiteAccess } from '../sites/access';
import { saveOrderedRows } from '../systems/ordered-rows';
import { findSystemRow, type SystemRow } from '../systems/repository';
import { listDevices } from './repository';
import type { saveDevicesSchema } from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;
type DeviceInput = z.output<typeof saveDevicesSchema>['devices'][number];

export async function getDeviceList(db: Knex, siteId: string) {
  const system = await findSystemRow(db, siteId);
  if (!system) return { devicesVersion: null, devices: [] };
  return { devicesVersion: system.devices_version, devices: await listDevices(db, system.id) };
}

const deviceColumns = (device: DeviceInput) => ({
  kind: device.kind,
  location: device.location,
  model: device.model,
  area_id: device.areaId,
  grade: device.grade,
  environmental_class: device.environmentalClass,
  quiescent_ma: device.quiescentMa,
  alarm_ma: device.alarmMa,
});

export async function saveDeviceList(
  db: Knex,
  access: SiteAccess,
  input: z.output<typeof saveDevicesSchema>,
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const system = await findSystemRow(trx, access.id);
    if (!system)
      throw new ConflictError('Record the control panel on the System tab before adding devices.');
    await updateAtVersion<SystemRow>(
      trx,
      'systems',
      { id: system.id },
      input.devicesVersion,
      { updated_at: trx.fn.now() },
      'devices_version',
    );
    const counts = await saveOrderedRows(trx, {
      table: 'devices',
      systemId: system.id,
      listName: 'devices',
      rows: input.devices,
      toColumns: deviceColumns,
    });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'devices.saved',
      entityType: 'system',
      entityId: system.id,
      organisationId: access.installerId,
      summary: `Saved the device list: ${input.devices.length} device(s), ${counts.inserted} added, ${counts.deleted} removed`,
      changes: {
        devices: { to: input.devices.map((device) => `${device.kind} ${device.location}`) },
      },
    });
  });
  return getDeviceList(db, access.id);
}
