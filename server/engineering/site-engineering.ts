import type { Knex } from 'knex';
import { coreOhmsPerMetre, runLoopOhms, type CoreBuild } from '../calc/cable';
import {
  environmentalMismatches,
  systemGrade,
  type ClassMismatch,
  type SystemGrade,
} from '../calc/grade';
import { loopBands, UNKNOWN_CABLE_OHMS, type Band, type LoopDesign } from '../calc/loop';
import { powerBudget, standbyHours, type PowerBudget, type PoweredItem } from '../calc/power';
import { DEVICE_KIND_LABELS } from '../devices/schema';
import { listDevices } from '../devices/repository';
import type { Device } from '../devices/schema';
import { findSystemRow, type SystemRow } from '../systems/repository';
import { listZones } from '../zones/repository';
import type { Zone } from '../zones/schema';

export const CABLE_BUILDS: Record<SystemRow['cable_core'], CoreBuild> = {
  '7/0.2': { strands: 7, strandDiameterMm: 0.2 },
  '16/0.2': { strands: 16, strandDiameterMm: 0.2 },
};

/**
 * The cable's share of a zone's readings: computed from its run when recorded, across 0–40 °C
 * of cable temperature (common practice, no source); otherwise a general allowance.
 */
export function cableOhmsFor(
  zone: Pick<Zone, 'cableMetres' | 'coresPerLeg'>,
  cableCore: SystemRow['cable_core'],
) {
  if (zone.cableMetres === null) return UNKNOWN_CABLE_OHMS;
  const build = CABLE_BUILDS[cableCore];
  const at = (celsius: number) =>
    runLoopOhms(zone.cableMetres!, coreOhmsPerMetre(build, celsius), zone.coresPerLeg);
  return { min: at(0), max: at(40) };
}

export function loopDesignFor(
  zone: Pick<Zone, 'loopWiring' | 'tamperOhms' | 'alarmOhms' | 'cableMetres' | 'coresPerLeg'>,
  system: Pick<SystemRow, 'resistor_tolerance' | 'cable_core'>,
): LoopDesign {
  return {
    wiring: zone.loopWiring,
    tamperOhms: zone.tamperOhms,
    alarmOhms: zone.alarmOhms,
    tolerance: Number(system.resistor_tolerance),
    cableOhms: cableOhmsFor(zone, system.cable_core),
  };
}

export interface ZoneEngineering {
  zoneId: string;
  number: number;
  location: string;
  design: LoopDesign;
  bands: Band[];
  problems: string[];
}

export type PowerBudgetResult =
  ({ available: true; standbySource: string } & PowerBudget) | { available: false; reason: string };

export interface SiteEngineering {
  zones: ZoneEngineering[];
  power: PowerBudgetResult;
  grade: SystemGrade;
  requiredGrade: number;
  environmentalMismatches: ClassMismatch[];
}

const zoneLabel = (zone: Pick<Zone, 'number' | 'location'>) =>
  `Zone ${zone.number} (${zone.location})`;
const deviceLabel = (device: Device) => `${DEVICE_KIND_LABELS[device.kind]} (${device.location})`;

export function powerItems(system: SystemRow, zones: Zone[], devices: Device[]): PoweredItem[] {
  const items: PoweredItem[] = [];
  if (system.panel_quiescent_ma !== null || system.panel_alarm_ma !== null) {
    items.push({
      label: 'Control panel',
      quiescentMa: Number(system.panel_quiescent_ma ?? 0),
      alarmMa: Number(system.panel_alarm_ma ?? 0),
    });
  }
  for (const zone of zones) {
    if (zone.quiescentMa || zone.alarmMa) {
      items.push({
        label: zoneLabel(zone),
        quiescentMa: zone.quiescentMa ?? 0,
        alarmMa: zone.alarmMa ?? 0,
      });
    }
  }
  for (const device of devices) {
    if (device.quiescentMa || device.alarmMa) {
      items.push({
        label: deviceLabel(device),
        quiescentMa: device.quiescentMa ?? 0,
        alarmMa: device.alarmMa ?? 0,
      });
    }
  }
  return items;
}

export function computePower(
  system: SystemRow,
  grade: number,
  items: PoweredItem[],
): PowerBudgetResult {
  const override =
    system.standby_hours_override === null ? null : Number(system.standby_hours_override);
  const lookedUp = standbyHours({
    grade,
    psuType: system.psu_type,
    mainsFailureSignalled: system.mains_failure_signalled,
  });
  const hours = override ?? lookedUp.hours;
  if (hours === null)
    return { available: false, reason: 'reason' in lookedUp ? lookedUp.reason : '' };
  const budget = powerBudget({
    items,
    standbyHours: hours,
    alarmMinutes: system.sounder_minutes,
    batteryAh: system.battery_ah === null ? null : Number(system.battery_ah),
  });
  return {
    available: true,
    standbySource:
      override !== null
        ? "the site's specification (entered on the system)"
        : 'source' in lookedUp
          ? lookedUp.source
          : '',
    ...budget,
  };
}

/** Everything the calculations say about one site's system, from its stored record. */
export async function siteEngineering(db: Knex, siteId: string): Promise<SiteEngineering | null> {
  const [site, system] = await Promise.all([
    db('sites')
      .where({ id: siteId })
      .first<{ required_grade: number; environmental_class: number }>(
        'required_grade',
        'environmental_class',
      ),
    findSystemRow(db, siteId),
  ]);
  if (!site || !system) return null;
  const [zones, devices] = await Promise.all([
    listZones(db, system.id),
    listDevices(db, system.id),
  ]);

  const zoneResults = zones.map((zone) => {
    const design = loopDesignFor(zone, system);
    const { bands, problems } = loopBands(design);
    return {
      zoneId: zone.id,
      number: zone.number,
      location: zone.location,
      design,
      bands,
      problems,
    };
  });
  const grade = systemGrade([
    { label: 'Control panel', grade: system.panel_grade },
    ...zones.map((zone) => ({ label: zoneLabel(zone), grade: zone.grade })),
    ...devices.map((device) => ({ label: deviceLabel(device), grade: device.grade })),
  ]);
  return {
    zones: zoneResults,
    power: computePower(system, site.required_grade, powerItems(system, zones, devices)),
    grade,
    requiredGrade: site.required_grade,
    environmentalMismatches: environmentalMismatches(
      [
        ...zones.map((zone) => ({
          label: zoneLabel(zone),
          location: zone.location,
          environmentalClass: zone.environmentalClass,
        })),
        ...devices.map((device) => ({
          label: deviceLabel(device),
          location: device.location,
          environmentalClass: device.environmentalClass,
        })),
      ],
      site.environmental_class,
    ),
  };
}
