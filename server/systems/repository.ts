import type { Knex } from 'knex';
import type { SystemRecord } from './schema';

interface SystemRow {
  id: string;
  site_id: string;
  control_panel: string;
  firmware: string;
  panel_location: string;
  psu_type: 'A' | 'B' | 'C' | null;
  battery_ah: string | null;
  notification: 'A' | 'B' | 'C' | 'D' | 'E' | 'F' | null;
  mains_failure_signalled: boolean;
  panel_grade: number | null;
  panel_quiescent_ma: string | null;
  panel_alarm_ma: string | null;
  sounder_minutes: number;
  standby_hours_override: string | null;
  resistor_tolerance: string;
  cable_core: '7/0.2' | '16/0.2';
  supply_volts: string;
  version: number;
  zones_version: number;
  devices_version: number;
  updated_at: Date;
}

const decimal = (value: string | null) => (value === null ? null : Number(value));

export function findSystemRow(db: Knex, siteId: string) {
  return db<SystemRow>('systems').where({ site_id: siteId }).first();
}

export function listAreas(db: Knex, systemId: string) {
  return db('areas')
    .where({ system_id: systemId })
    .orderBy('number')
    .select<{ id: string; number: number; name: string }[]>('id', 'number', 'name');
}

export async function getSystemRecord(db: Knex, siteId: string): Promise<SystemRecord | null> {
  const system = await findSystemRow(db, siteId);
  if (!system) return null;
  const [paths, areas] = await Promise.all([
    db('signalling_paths').where({ system_id: system.id }).orderBy('position'),
    listAreas(db, system.id),
  ]);
  return {
    id: system.id,
    controlPanel: system.control_panel,
    firmware: system.firmware,
    panelLocation: system.panel_location,
    psuType: system.psu_type,
    batteryAh: system.battery_ah === null ? null : Number(system.battery_ah),
    notification: system.notification,
    mainsFailureSignalled: system.mains_failure_signalled,
    panelGrade: system.panel_grade,
    panelQuiescentMa: decimal(system.panel_quiescent_ma),
    panelAlarmMa: decimal(system.panel_alarm_ma),
    sounderMinutes: system.sounder_minutes,
    standbyHoursOverride: decimal(system.standby_hours_override),
    resistorTolerance: Number(system.resistor_tolerance),
    cableCore: system.cable_core,
    supplyVolts: Number(system.supply_volts),
    signallingPaths: paths.map((path) => ({
      id: path.id,
      position: path.position,
      bearer: path.bearer,
      atsCategory: path.ats_category,
      description: path.description,
      toMonitoringCentre: path.to_monitoring_centre,
    })),
    areas,
    version: system.version,
    updatedAt: system.updated_at.toISOString(),
  };
}

export type { SystemRow };
