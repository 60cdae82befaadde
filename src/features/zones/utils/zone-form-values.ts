import type { z } from 'zod';

import type { saveZonesSchema, Zone, ZoneInput, ZoneSchedule } from '@server/zones/schema';

export type ZoneScheduleFormValues = z.input<typeof saveZonesSchema>;

export function toZoneFormRow(zone: Zone): ZoneInput {
  return {
    id: zone.id,
    number: zone.number,
    location: zone.location,
    zoneType: zone.zoneType,
    detectorKind: zone.detectorKind,
    detectorModel: zone.detectorModel,
    loopWiring: zone.loopWiring,
    tamperOhms: zone.tamperOhms,
    alarmOhms: zone.alarmOhms,
    coreMap: zone.coreMap.map((core) => ({ colour: core.colour, terminal: core.terminal })),
    cableMetres: zone.cableMetres,
    coresPerLeg: zone.coresPerLeg,
    areaId: zone.areaId,
    attributes: [...zone.attributes],
    grade: zone.grade,
    environmentalClass: zone.environmentalClass,
    quiescentMa: zone.quiescentMa,
    alarmMa: zone.alarmMa,
  };
}

export function toScheduleFormValues(
  schedule: ZoneSchedule,
  zonesVersion: number,
): ZoneScheduleFormValues {
  return { zonesVersion, zones: schedule.zones.map(toZoneFormRow) };
}

// Left empty on purpose: the select shows "Choose…" and the shared schema asks for a choice,
// rather than Wardbook guessing what was fitted.
const unchosen = '' as never;

/**
 * A new row. Wiring, resistor values, cores per leg, area, grade and class usually run the same
 * through an installation, so they follow the row above; what the zone is, where, and how long
 * its cable run is are for the engineer.
 */
export function newZoneRow(number: number, previous?: ZoneInput): ZoneInput {
  return {
    number,
    location: '',
    zoneType: unchosen,
    detectorKind: unchosen,
    detectorModel: '',
    loopWiring: previous?.loopWiring ?? unchosen,
    tamperOhms: previous?.tamperOhms ?? null,
    alarmOhms: previous?.alarmOhms ?? null,
    coreMap: [],
    // Each detector has its own run; the cable build usually follows the row above.
    cableMetres: null,
    coresPerLeg: previous?.coresPerLeg ?? 1,
    areaId: previous?.areaId ?? null,
    attributes: [],
    grade: previous?.grade ?? null,
    environmentalClass: previous?.environmentalClass ?? null,
    quiescentMa: null,
    alarmMa: null,
  };
}

/** A copy of a row with every setting but its identity: a new zone under a new number. */
export function duplicateZoneRow(source: ZoneInput, number: number): ZoneInput {
  const { id: _id, ...settings } = structuredClone(source);
  return { ...settings, number };
}

const shownZoneField =
  /^zones\.\d+\.(number|location|zoneType|detectorKind|detectorModel|loopWiring|tamperOhms|alarmOhms|cableMetres|coresPerLeg|areaId|attributes|grade|environmentalClass|quiescentMa|alarmMa|coreMap|coreMap\.\d+\.(colour|terminal))$/;

/** Field paths the editor shows beside a field; any other API message goes in the summary. */
export function isZoneFieldShown(fieldPath: string): boolean {
  return shownZoneField.test(fieldPath);
}
