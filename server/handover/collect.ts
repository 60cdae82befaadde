import type { Knex } from 'knex';
import { toRkm } from '../calc/notation';
import {
  addCalendarMonths,
  intervalMonthsFor,
  SERVICE_PLAN_RULE,
  SERVICE_PLAN_SOURCE,
} from '../calc/service-plan';
import {
  latestSitingChecks,
  latestSystemTests,
  latestWalkTests,
  toWalkTest,
} from '../commissioning/repository';
import { DEVICE_KIND_LABELS } from '../devices/schema';
import { listDevices } from '../devices/repository';
import { powerItems, siteEngineering } from '../engineering/site-engineering';
import { NotFoundError } from '../http/errors';
import { listKeyholders } from '../keyholders/repository';
import { listUserSlots } from '../user-slots/repository';
import { getSystemRecord, findSystemRow, listAreas } from '../systems/repository';
import { listZones } from '../zones/repository';
import { DETECTOR_KIND_LABELS, LOOP_WIRING_LABELS, ZONE_TYPE_LABELS } from '../zones/schema';
import type { Zone } from '../zones/schema';
import { packSnapshotSchema, type PackSnapshot, type SnapshotSignature } from './snapshot';

export interface PackMeta {
  packNumber: string;
  revision: number;
  supersedes: string | null;
  issuedAt: Date;
  preview: boolean;
  verifyUrl: string;
  variations: { text: string; acceptedAt: string | null }[];
  engineer: SnapshotSignature | null;
  customer: SnapshotSignature | null;
}

const MOTION = new Set<Zone['detectorKind']>(['pir', 'dual_technology']);

const URN_STATUS_WORDS: Record<string, string> = {
  none: 'No URN',
  applied: 'Applied for',
  active: 'Active',
  warning: 'Warning',
  withdrawn: 'Withdrawn',
};

function wiringWords(zone: Zone): string {
  const label = LOOP_WIRING_LABELS[zone.loopWiring];
  const values = [zone.tamperOhms, zone.alarmOhms]
    .filter((value): value is number => value !== null)
    .map((value) => toRkm(value));
  return values.length > 0 ? `${label} ${values.join(' / ')}` : label;
}

function expectedFromResistors(zone: Zone): {
  normalOhms: number | null;
  alarmOhms: number | null;
} {
  switch (zone.loopWiring) {
    case 'two_resistor':
      return {
        normalOhms: zone.tamperOhms,
        alarmOhms:
          zone.tamperOhms !== null && zone.alarmOhms !== null
            ? zone.tamperOhms + zone.alarmOhms
            : null,
      };
    case 'one_resistor':
      // The alarm contact opens the loop: an open circuit, shown as OL.
      return { normalOhms: zone.alarmOhms, alarmOhms: null };
    default:
      return { normalOhms: 0, alarmOhms: null };
  }
}

const londonDay = new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London' });

function testSummary(kind: string, details: Record<string, unknown>): string {
  switch (kind) {
    case 'sounders':
      return [
        `internal sounder ${details.internalSounded ? 'sounded' : 'did not sound'}`,
        `external sounder ${details.externalSounded ? 'sounded' : 'did not sound'}`,
        `strobe ${details.strobeFlashed ? 'flashed' : 'did not flash'}`,
      ].join(', ');
    case 'signalling':
      return `path ${String(details.pathPosition)}: ${details.receivedByCentre ? 'received by the monitoring centre' : 'not received'}${details.centreReference ? ` (centre reference ${String(details.centreReference)})` : ''}`;
    default:
      return `${String(details.restingVolts)} V at rest, ${String(details.loadVolts)} V under a ${String(details.loadAmps)} A load for ${String(details.loadMinutes)} min`;
  }
}

/**
 * Gathers every value the handover pack shows from the site's records, at this moment, into
 * one plain object. Issue freezes it; the PDF is drawn from it and nothing else.
 */
export async function collectPackSnapshot(
  db: Knex,
  siteId: string,
  meta: PackMeta,
): Promise<PackSnapshot> {
  const site = await db('sites as s')
    .join('organisations as i', 'i.id', 's.installer_id')
    .leftJoin('organisations as mc', 'mc.id', 's.monitoring_centre_id')
    .where('s.id', siteId)
    .first(
      's.*',
      'i.name as installer_name',
      'i.phone as installer_phone',
      'i.email as installer_email',
      'mc.name as centre_name',
    );
  if (!site) throw new NotFoundError();
  const systemRow = await findSystemRow(db, siteId);
  if (!systemRow) throw new NotFoundError('The system is not recorded yet.');
  const [system, engineering, areas, devices, walkTests, siting, systemTests, keyholders, slots] =
    await Promise.all([
      getSystemRecord(db, siteId),
      siteEngineering(db, siteId),
      listAreas(db, systemRow.id),
      listDevices(db, systemRow.id),
      latestWalkTests(db, systemRow.id),
      latestSitingChecks(db, systemRow.id),
      latestSystemTests(db, systemRow.id),
      listKeyholders(db, siteId),
      listUserSlots(db, siteId),
    ]);
  if (!system || !engineering) throw new NotFoundError('The system is not recorded yet.');
  const zones = await listZones(db, systemRow.id);
  const areaName = new Map(areas.map((area: { id: string; name: string }) => [area.id, area.name]));
  const walkByZone = new Map(walkTests.map((test) => [test.zone_id, test]));
  const sitingByZone = new Map(siting.map((check) => [check.zone_id, check]));
  const engineeringByZone = new Map(engineering.zones.map((entry) => [entry.zoneId, entry]));
  const testsByKind = new Map(systemTests.map((test) => [test.kind, test]));
  const monitored = site.monitoring_centre_id !== null;
  const visitsPerYear = monitored ? 2 : 1;

  const snapshot: PackSnapshot = {
    version: 1,
    packNumber: meta.packNumber,
    revision: meta.revision,
    supersedes: meta.supersedes,
    issuedAt: meta.issuedAt.toISOString(),
    preview: meta.preview,
    verifyUrl: meta.verifyUrl,
    installer: {
      name: site.installer_name,
      addressLines: [],
      phone: site.installer_phone ?? '',
      email: site.installer_email ?? '',
    },
    site: {
      reference: site.reference,
      name: site.name,
      addressLines: [site.address_line1, site.address_line2, site.town, site.postcode].filter(
        (line: string | null) => line,
      ),
      premisesType: site.premises_type,
      requiredGrade: site.required_grade,
      gradeRationale: site.grade_rationale ?? '',
      environmentalClass: site.environmental_class ?? null,
      riskNotes: site.risk_notes ?? '',
      hazards: site.hazards ?? '',
    },
    system: {
      controlPanel: system.controlPanel,
      firmware: system.firmware,
      panelLocation: system.panelLocation,
      psuType: system.psuType,
      batteryAh: system.batteryAh,
      notification: system.notification,
      grade: engineering.grade.grade,
      gradeLimitedBy: engineering.grade.limitedBy,
      standards: [
        'BS EN 50131-1 Alarm systems: intrusion and hold-up systems, system requirements',
        'PD 6662 Scheme for the application of European standards for intrusion and hold-up alarm systems',
        ...(monitored
          ? ['BS 8243 Remote-signalling intrusion and hold-up alarm systems: confirmation']
          : []),
        'BS 8473 Intruder and hold-up alarm systems: management of false alarms',
      ],
      signallingPaths: system.signallingPaths.map((path) => ({
        bearer: path.bearer,
        atsCategory: path.atsCategory,
        description: path.description,
      })),
    },
    zones: zones.map((zone) => {
      const design = engineeringByZone.get(zone.id);
      const bands = (design?.bands ?? []).map((band) => ({
        state: band.state,
        nominalOhms: Number.isFinite(band.nominalOhms) ? band.nominalOhms : null,
        lowOhms: band.lowOhms,
        highOhms: Number.isFinite(band.highOhms) ? band.highOhms : null,
      }));
      // What the trade writes on a schedule: the resistors' own values (2K2 secure, 6K9 in
      // alarm), not the band's middle, which carries half the cable allowance.
      const expected = expectedFromResistors(zone);
      const test = walkByZone.get(zone.id);
      const check = sitingByZone.get(zone.id);
      const walk = test ? toWalkTest(test) : null;
      return {
        number: zone.number,
        location: zone.location,
        area: zone.areaId ? (areaName.get(zone.areaId) ?? null) : null,
        zoneType: ZONE_TYPE_LABELS[zone.zoneType],
        detectorKind: DETECTOR_KIND_LABELS[zone.detectorKind],
        wiring: wiringWords(zone),
        grade: zone.grade,
        environmentalClass: zone.environmentalClass,
        bands,
        expected,
        measured: walk
          ? {
              secureOhms: walk.secureReadingOhms,
              secureState: walk.secureState,
              alarmOhms: walk.alarmReadingOhms,
              alarmState: walk.alarmState,
              activated: walk.activated,
              passed: walk.passed,
              testedAt: walk.testedAt,
              testedBy: walk.testedBy,
            }
          : null,
        siting: !MOTION.has(zone.detectorKind)
          ? ('not_applicable' as const)
          : !check
            ? ('not_checked' as const)
            : check.all_clear
              ? ('all_clear' as const)
              : ('needs_attention' as const),
      };
    }),
    devices: devices.map((device) => ({
      kind: DEVICE_KIND_LABELS[device.kind],
      location: device.location,
      grade: device.grade,
      environmentalClass: device.environmentalClass,
    })),
    power: engineering.power.available
      ? {
          available: true as const,
          standbyHours: engineering.power.standbyHours,
          standbySource: engineering.power.standbySource,
          alarmMinutes: Math.round(engineering.power.alarmHours * 60),
          quiescentMa: engineering.power.quiescentMa,
          alarmMa: engineering.power.alarmMa,
          ageingFactor: engineering.power.ageingFactor,
          requiredAh: engineering.power.requiredAh,
          batteryAh: engineering.power.batteryAh,
          passes: engineering.power.passes,
          working: engineering.power.working,
          items: powerItems(systemRow, zones, devices).map((item) => ({
            label: item.count && item.count > 1 ? `${item.label} × ${item.count}` : item.label,
            quiescentMa: item.quiescentMa * (item.count ?? 1),
            alarmMa: item.alarmMa * (item.count ?? 1),
          })),
        }
      : { available: false as const, reason: engineering.power.reason },
    tests: {
      sounders: null,
      signalling: null,
      battery: null,
    },
    keyholders: keyholders.map((keyholder) => ({
      position: keyholder.callOrder,
      name: keyholder.name,
      phone: keyholder.phone,
      attendMinutes: keyholder.minutesToAttend,
    })),
    userSlots: slots
      .filter((slot) => slot.active)
      .map((slot) => ({ slot: slot.slot, holder: slot.holderName, level: slot.accessLevel })),
    monitoring: monitored
      ? {
          centreName: site.centre_name,
          accountNumber: site.monitoring_account ?? null,
          policeUrn: site.police_urn ?? null,
          urnStatus: URN_STATUS_WORDS[site.urn_status] ?? site.urn_status,
        }
      : null,
    servicePlan: {
      visitsPerYear,
      // The same plan the service schedule keeps: calendar months from the day of issue in
      // the UK, clamped to the month's end (31 August + 6 months is the end of February).
      nextVisitDue: addCalendarMonths(
        londonDay.format(meta.issuedAt),
        intervalMonthsFor(visitsPerYear),
      ),
      basis: `${monitored ? 'Remotely monitored' : 'Audible-only'}: ${SERVICE_PLAN_RULE} (${SERVICE_PLAN_SOURCE}).`,
    },
    variations: meta.variations,
    engineer: meta.engineer,
    customer: meta.customer,
  };
  for (const kind of ['sounders', 'signalling', 'battery'] as const) {
    const test = testsByKind.get(kind);
    if (test)
      snapshot.tests[kind] = {
        passed: test.passed,
        testedAt: test.tested_at.toISOString(),
        summary: testSummary(kind, test.details as Record<string, unknown>),
      };
  }
  // The pack must never carry a value its own schema would refuse.
  return packSnapshotSchema.parse(snapshot);
}
