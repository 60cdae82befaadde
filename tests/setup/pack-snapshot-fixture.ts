import { classifyReading, loopBands, type LoopDesign } from '../../server/calc/loop';
import { powerBudget, STANDBY_SOURCE } from '../../server/calc/power';
import {
  packSnapshotSchema,
  type PackSnapshot,
  type SnapshotZone,
} from '../../server/handover/snapshot';
import { signaturePng } from './signature-png';

/**
 * An invented handover-pack snapshot for the renderer's tests and benchmark: the demo
 * scenario's made-up installer and town (seeds/data), people invented here, phone numbers
 * from Ofcom's drama range (07700 900xxx), e-mail at example.com.
 */

// --- Zones ------------------------------------------------------------------------------

type Wiring = '2K2/4K7' | '1K/1K' | 'closed';

interface ZonePlan {
  location: string;
  area: string | null;
  zoneType: string;
  detector: string;
  wiring: Wiring;
  /** The meter's secure reading; Infinity for "OL". */
  secure: number;
  /** The reading with the detector activated; Infinity for "OL". */
  alarm: number;
  motion: boolean;
}

const PIR = 'Passive infrared (PIR)';
const DUAL = 'Dual technology (PIR + microwave)';
const CONTACT = 'Magnetic door/window contact';

/** The first eight zones of the Marsh residence; zone 6's contact cable reads high. */
const HOME_ZONES: ZonePlan[] = [
  {
    location: 'Front door',
    area: 'Ground floor',
    zoneType: 'Entry/exit',
    detector: CONTACT,
    wiring: '2K2/4K7',
    secure: 2213,
    alarm: 6921,
    motion: false,
  },
  {
    location: 'Hall and stairs',
    area: 'Ground floor',
    zoneType: 'Entry route',
    detector: PIR,
    wiring: '2K2/4K7',
    secure: 2208,
    alarm: 6917,
    motion: true,
  },
  {
    location: 'Lounge',
    area: 'Ground floor',
    zoneType: 'Instant',
    detector: DUAL,
    wiring: '2K2/4K7',
    secure: 2231,
    alarm: 6952,
    motion: true,
  },
  {
    location: 'Kitchen and utility',
    area: 'Ground floor',
    zoneType: 'Instant',
    detector: PIR,
    wiring: '1K/1K',
    secure: 1006,
    alarm: 2009,
    motion: true,
  },
  {
    location: 'Back door',
    area: 'Ground floor',
    zoneType: 'Instant',
    detector: CONTACT,
    wiring: 'closed',
    secure: 3.4,
    alarm: Number.POSITIVE_INFINITY,
    motion: false,
  },
  {
    location: 'Garage side door',
    area: 'Garage',
    zoneType: 'Instant',
    detector: CONTACT,
    wiring: '2K2/4K7',
    secure: 2712,
    alarm: 7420,
    motion: false,
  },
  {
    location: 'Landing',
    area: 'First floor',
    zoneType: 'Instant',
    detector: PIR,
    wiring: '2K2/4K7',
    secure: 2219,
    alarm: 6930,
    motion: true,
  },
  {
    location: 'Main bedroom hold-up button',
    area: 'First floor',
    zoneType: 'Hold-up (PA)',
    detector: 'Hold-up button',
    wiring: '2K2/4K7',
    secure: 2224,
    alarm: 6938,
    motion: false,
  },
];

const MORE_ROOMS = [
  'Dining room',
  'Study',
  'Conservatory',
  'Rear lobby',
  'Workshop',
  'Garden room',
  'Boot room',
  'Playroom',
  'Snug',
  'Cellar steps',
];

/** Zones beyond the first eight, for long schedules: movement detectors, all passing. */
function extraZone(index: number): ZonePlan {
  const room = MORE_ROOMS[index % MORE_ROOMS.length]!;
  const round = Math.floor(index / MORE_ROOMS.length);
  const oneK = index % 5 === 4;
  return {
    location: round === 0 ? room : `${room} ${round + 1}`,
    area: index % 2 === 0 ? 'Ground floor' : 'Outbuildings',
    zoneType: 'Instant',
    detector: index % 3 === 0 ? DUAL : PIR,
    wiring: oneK ? '1K/1K' : '2K2/4K7',
    secure: (oneK ? 1000 : 2200) + 4 + (index % 7) * 3,
    alarm: (oneK ? 2000 : 6900) + 6 + (index % 5) * 4,
    motion: true,
  };
}

const WIRING: Record<Wiring, { label: string; design: Omit<LoopDesign, 'cableOhms'> }> = {
  '2K2/4K7': {
    label: 'Two-resistor loop 2K2 / 4K7',
    design: { wiring: 'two_resistor', tamperOhms: 2200, alarmOhms: 4700, tolerance: 0.05 },
  },
  '1K/1K': {
    label: 'Two-resistor loop 1K / 1K',
    design: { wiring: 'two_resistor', tamperOhms: 1000, alarmOhms: 1000, tolerance: 0.05 },
  },
  closed: {
    label: 'Closed loop with separate tamper pair',
    design: {
      wiring: 'closed_loop_separate_tamper',
      tamperOhms: null,
      alarmOhms: null,
      tolerance: 0.05,
    },
  },
};

const ENGINEER = 'Callum Reyes';
const ISSUED_AT = '2026-12-02T15:40:00.000Z';

function snapshotZone(plan: ZonePlan, number: number): SnapshotZone {
  const wiring = WIRING[plan.wiring];
  // A 7/0.2 run of about 20–40 m: a few ohms of cable on every reading.
  const design: LoopDesign = { ...wiring.design, cableOhms: { min: 2, max: 8 } };
  const { bands } = loopBands(design);
  const secure = classifyReading(design, plan.secure);
  const alarm = classifyReading(design, plan.alarm);
  const passed = secure.state === 'normal' && alarm.state === 'alarm';
  const tamper = wiring.design.tamperOhms;
  const alarmResistor = wiring.design.alarmOhms;
  return {
    number,
    location: plan.location,
    area: plan.area,
    zoneType: plan.zoneType,
    detectorKind: plan.detector,
    wiring: wiring.label,
    grade: 2,
    environmentalClass: plan.area === 'Outbuildings' || plan.area === 'Garage' ? 3 : 2,
    bands: bands.map((band) => ({
      state: band.state,
      nominalOhms: Number.isFinite(band.nominalOhms) ? band.nominalOhms : null,
      lowOhms: band.lowOhms,
      highOhms: Number.isFinite(band.highOhms) ? band.highOhms : null,
    })),
    // What the resistors give with no cable: 2.2 kΩ secure, 2.2 + 4.7 = 6.9 kΩ in alarm.
    expected:
      tamper !== null && alarmResistor !== null
        ? { normalOhms: tamper, alarmOhms: tamper + alarmResistor }
        : { normalOhms: 0, alarmOhms: null },
    measured: {
      secureOhms: Number.isFinite(plan.secure) ? plan.secure : null,
      secureState: secure.state,
      alarmOhms: Number.isFinite(plan.alarm) ? plan.alarm : null,
      alarmState: alarm.state,
      activated: true,
      passed,
      testedAt: new Date(Date.parse(ISSUED_AT) - (60 - number) * 3 * 60_000).toISOString(),
      testedBy: ENGINEER,
    },
    siting: plan.motion ? 'all_clear' : 'not_applicable',
  };
}

// --- The snapshot -------------------------------------------------------------------------

export function packSnapshotFixture(
  options: { zones?: number; preview?: boolean } = {},
): PackSnapshot {
  const zoneCount = options.zones ?? 8;
  const preview = options.preview ?? false;
  const plans = Array.from({ length: zoneCount }, (_, index) =>
    index < HOME_ZONES.length ? HOME_ZONES[index]! : extraZone(index - HOME_ZONES.length),
  );
  const zones = plans.map((plan, index) => snapshotZone(plan, index + 1));
  const movement = plans.filter((plan) => plan.motion).length;

  const items = [
    { label: 'Control panel with communicator', quiescentMa: 110, alarmMa: 150 },
    { label: 'Keypad, hall', quiescentMa: 35, alarmMa: 60 },
    {
      label: `Movement detectors × ${movement}`,
      quiescentMa: 15 * movement,
      alarmMa: 15 * movement,
    },
    { label: 'External sounder and strobe', quiescentMa: 20, alarmMa: 450 },
    { label: 'Internal sounder, landing', quiescentMa: 0, alarmMa: 200 },
  ];
  const batteryAh = zoneCount > 20 ? 17 : 7;
  const budget = powerBudget({ items, standbyHours: 12, alarmMinutes: 15, batteryAh });
  const packNumber = 'FA-000147-R2';

  const snapshot: PackSnapshot = {
    version: 1,
    packNumber,
    revision: 2,
    supersedes: 'FA-000147-R1',
    issuedAt: ISSUED_AT,
    preview,
    verifyUrl: `https://wardbook.example.com/verify/${packNumber}`,
    installer: {
      name: 'Fernmoor Alarm Services Ltd',
      addressLines: ['Unit 4, Saltings Way', 'Eastmere', 'EM2 7LD'],
      phone: '07700 900100',
      email: 'fernmoor.office@example.com',
    },
    site: {
      reference: 'S-00012',
      name: 'Marsh residence',
      addressLines: ['14 Kestrel Lane', 'Eastmere', 'EM1 4QT'],
      premisesType: 'domestic',
      requiredGrade: 2,
      gradeRationale:
        'Detached house with average contents; insurer asks for a grade 2 system with remote signalling.',
      environmentalClass: 2,
      riskNotes: 'Garage is detached and unheated; its detectors are environmental class III.',
      hazards: 'Loft hatch over the stairwell: ladder work at height. Dog on the premises.',
    },
    system: {
      controlPanel: 'Eight-zone hybrid control panel (invented model)',
      firmware: '3.14.2',
      panelLocation: 'cupboard under the stairs',
      psuType: 'A',
      batteryAh,
      notification: 'C',
      grade: 2,
      gradeLimitedBy: ['Keypad, hall (grade 2)', 'Zone 1 door contact (grade 2)'],
      standards: [
        'BS EN 50131-1 Alarm systems: intrusion and hold-up systems, system requirements',
        'PD 6662 Scheme for the application of European standards for intrusion and hold-up alarm systems',
        'BS 8243 Remote-signalling intrusion and hold-up alarm systems: confirmation',
        'BS 8473 Intruder and hold-up alarm systems: management of false alarms',
      ],
      signallingPaths: [
        {
          bearer: 'IP over home broadband',
          atsCategory: 'DP2',
          description: 'Primary path; supervised by the monitoring centre.',
        },
        {
          bearer: 'Mobile data (4G)',
          atsCategory: 'DP2',
          description: 'Secondary path; takes over if the broadband fails.',
        },
      ],
    },
    zones,
    devices: [
      { kind: 'Keypad', location: 'Hall, by the front door', grade: 2, environmentalClass: 2 },
      {
        kind: 'External sounder',
        location: 'Front elevation, under the eaves',
        grade: 2,
        environmentalClass: 4,
      },
      { kind: 'Internal sounder', location: 'Landing ceiling', grade: 2, environmentalClass: 2 },
      {
        kind: 'Communicator',
        location: 'Inside the control panel',
        grade: 2,
        environmentalClass: 2,
      },
    ],
    power: {
      available: true,
      standbyHours: budget.standbyHours,
      standbySource: STANDBY_SOURCE,
      alarmMinutes: 15,
      quiescentMa: budget.quiescentMa,
      alarmMa: budget.alarmMa,
      ageingFactor: budget.ageingFactor,
      requiredAh: budget.requiredAh,
      batteryAh: budget.batteryAh,
      passes: budget.passes,
      working: budget.working,
      items,
    },
    tests: {
      sounders: {
        passed: true,
        testedAt: '2026-12-02T14:55:00.000Z',
        summary: 'internal sounder sounded, external sounder sounded, strobe flashed',
      },
      signalling: {
        passed: true,
        testedAt: '2026-12-02T15:05:00.000Z',
        summary: 'both paths received by the monitoring centre (centre reference HW-TEST-0912)',
      },
      battery: {
        passed: true,
        testedAt: '2026-12-02T15:20:00.000Z',
        summary: '13.5 V at rest, 12.7 V under a 1 A load for 10 min',
      },
    },
    // Deliberately out of call order: the pack must sort them.
    keyholders: [
      { position: 2, name: 'Priti Lindqvist', phone: '07700 900417', attendMinutes: 15 },
      { position: 1, name: 'Sam Whitlock', phone: '07700 900312', attendMinutes: 10 },
      { position: 3, name: 'Oliver Quayle', phone: '07700 900588', attendMinutes: 20 },
    ],
    userSlots: [
      { slot: 1, holder: 'Helen Marsh', level: 2 },
      { slot: 2, holder: 'Tom Marsh', level: 2 },
      { slot: 3, holder: 'Cleaner (Tuesdays)', level: 2 },
      { slot: 10, holder: 'Fernmoor engineer', level: 3 },
    ],
    monitoring: {
      centreName: 'Halden Watch Monitoring',
      accountNumber: '4E21',
      policeUrn: 'EMP/IA/26/0193',
      urnStatus: 'Active',
    },
    servicePlan: {
      visitsPerYear: 2,
      nextVisitDue: '2027-06-02',
      basis:
        'Remotely monitored: 2 preventive visits a year for remotely monitored systems, 1 for audible-only (from memory of PD 6662 / BS 9263 practice).',
    },
    variations: [
      {
        text: 'Zone 6 (garage side door) reads high and out of tolerance on its contact cable; the cable will be replaced at the first service visit.',
        acceptedAt: preview ? null : '2026-12-02T15:35:00.000Z',
      },
    ],
    engineer: preview
      ? null
      : { name: ENGINEER, image: signaturePng(1), signedAt: '2026-12-02T15:38:00.000Z' },
    customer: preview
      ? null
      : {
          name: 'Helen Marsh',
          image: signaturePng(4),
          signedAt: '2026-12-02T15:39:00.000Z',
        },
  };
  return packSnapshotSchema.parse(snapshot);
}
