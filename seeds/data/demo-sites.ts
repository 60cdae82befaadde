/**
 * The invented sites of the demo scenario: homes and small businesses in the made-up town of
 * Eastmere and its villages, maintained by Fernmoor Alarm Services. Streets, people and
 * postcodes ("EM" is not a real UK postcode area) are invented; phone numbers are from Ofcom's
 * drama ranges (07700 900xxx mobiles, 01632 960xxx landlines).
 */

/** A small deterministic generator so every fresh demo looks the same. */
export function seededRandom(seed: number) {
  let state = seed >>> 0;
  const next = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return {
    next,
    int: (min: number, max: number) => min + Math.floor(next() * (max - min + 1)),
    pick: <T>(items: readonly T[]): T => items[Math.floor(next() * items.length)]!,
  };
}

export const DEMO_ORGANISATION_CONTACTS = {
  installer: {
    phone: '+441632960100',
    out_of_hours_phone: '+441632960199',
    email: 'office@fernmoor-alarms.example.com',
  },
  monitoring_centre: {
    phone: '+441632960400',
    out_of_hours_phone: '+441632960400',
    email: 'control@haldenwatch.example.com',
  },
} as const;

export interface DemoSitePlan {
  name: string;
  premisesType: 'domestic' | 'commercial';
  addressLine1: string;
  town: string;
  postcode: string;
  grade: number;
  zones: number;
  monitored: boolean;
  hazards: string;
  accessNotes: string;
}

const STREETS = [
  'Kestrel Lane',
  'Mill Race Road',
  'Orchard Rise',
  'Saltings Way',
  'Chapel Walk',
  'Heron Close',
  'Tanners Row',
  'Beacon Hill Road',
  'Wharf Street',
  'Linden Grove',
  'Fenbridge Road',
  'Sedge Court',
];
const TOWNS = [
  { town: 'Eastmere', district: 'EM1' },
  { town: 'Eastmere', district: 'EM2' },
  { town: 'Little Haldon', district: 'EM7' },
  { town: 'Fernmoor', district: 'EM9' },
];
// 'Marsh' is kept for the demo homeowner's own home, the first site.
const SURNAMES = [
  'Okonjo',
  'Pelham',
  'Rowntree',
  'Varga',
  'Achterberg',
  'Quayle',
  'Lindqvist',
  'Brannigan',
  'Osei',
  'Ferreira',
  'Halloran',
  'Nakamura',
  'Szabo',
  'Ellery',
  'Mbeki',
  'Tremayne',
  'Kowalczyk',
  'Aldous',
  'Penhallow',
  'Iqbal',
  'Danvers',
  'Oyelaran',
  'Fairweather',
  'Castellano',
  'Moreland',
];
const BUSINESSES = [
  'Eastmere Pharmacy',
  'Saltings Boatyard',
  'The Tannery Bakery',
  'Heron Close Dental Practice',
  'Wharf Street Jewellers',
  'Beacon Hill Garden Centre',
  'Little Haldon Post Office',
];
const HAZARDS = [
  '',
  '',
  'Dog on the premises (friendly, but do not let it out).',
  'Steep unlit steps at the side entrance.',
  'Loft hatch over the stairwell: ladder work at height.',
  'Building refurbished in 1978: ask before drilling (possible asbestos in the garage ceiling).',
  'Lone attendance discouraged: isolated rural site with poor phone signal.',
];
const DOMESTIC_ACCESS = [
  'Key safe by the side gate; the monitoring centre gives its combination to attending keyholders.',
  'Front door key with keyholders only. Panel in the cupboard under the stairs.',
  'Side gate is bolted from inside; use the front door. Panel in the garage behind the freezer.',
];
const COMMERCIAL_ACCESS = [
  'Enter through the rear staff door. Panel in the stockroom, high on the left wall.',
  'Roller shutter key with keyholders. Panel in the office behind the counter.',
];

const UNIT_LETTERS = 'ABDEFGHJLNPQRSTUWXYZ';

export function demoSitePlans(count = 25): DemoSitePlan[] {
  const random = seededRandom(20261202);
  const plans: DemoSitePlan[] = [];
  for (let index = 0; index < count; index++) {
    const commercial = index % 4 === 3;
    const place = random.pick(TOWNS);
    const grade = commercial ? random.pick([2, 3, 3, 4]) : random.pick([2, 2, 2, 3]);
    const zones = commercial ? random.int(12, 40) : random.int(4, 16);
    plans.push({
      name: commercial
        ? BUSINESSES[Math.floor(index / 4) % BUSINESSES.length]!
        : `${SURNAMES[index % SURNAMES.length]} residence`,
      premisesType: commercial ? 'commercial' : 'domestic',
      addressLine1: `${random.int(1, 140)} ${random.pick(STREETS)}`,
      town: place.town,
      postcode: `${place.district} ${random.int(1, 9)}${random.pick([...UNIT_LETTERS])}${random.pick([...UNIT_LETTERS])}`,
      grade,
      zones,
      monitored: commercial || grade >= 3 || random.next() < 0.5,
      hazards: random.pick(HAZARDS),
      accessNotes: random.pick(commercial ? COMMERCIAL_ACCESS : DOMESTIC_ACCESS),
    });
  }
  // The busiest commercial site shows a full 40-zone schedule.
  const largest = plans.findIndex((plan) => plan.premisesType === 'commercial');
  plans[largest] = { ...plans[largest]!, zones: 40 };
  // The first site is the demo homeowner's own home, kept recognisable in the walkthrough.
  plans[0] = {
    ...plans[0]!,
    name: 'Marsh residence',
    premisesType: 'domestic',
    grade: 2,
    zones: 8,
    monitored: true,
  };
  return plans;
}

const DOMESTIC_ROOMS = [
  'Front door',
  'Hall',
  'Lounge',
  'Kitchen',
  'Back door',
  'Dining room',
  'Landing',
  'Bedroom 1',
  'Bedroom 2',
  'Study',
  'Conservatory',
  'Garage door',
  'Utility room',
  'Patio doors',
  'Bedroom 3',
  'Loft hatch',
];
const COMMERCIAL_ROOMS = [
  'Shop front door',
  'Sales floor',
  'Stockroom',
  'Rear fire exit',
  'Office',
  'Staff room',
  'Counter hold-up button',
  'Safe vibration sensor',
  'Roller shutter',
  'Goods-in door',
  'Workshop',
  'Server cupboard',
];

export interface DemoZone {
  number: number;
  location: string;
  zoneType: string;
  detectorKind: string;
  loopWiring: 'two_resistor' | 'one_resistor' | 'closed_loop_separate_tamper';
  tamperOhms: number | null;
  alarmOhms: number | null;
  coreMap: { colour: string; terminal: string }[];
  quiescentMa: number;
  alarmMa: number;
  attributes: string[];
}

/** A believable zone schedule: entry/exit door first, then the entry route, then the rest. */
export function demoZones(plan: DemoSitePlan, seed: number): DemoZone[] {
  const random = seededRandom(seed);
  const rooms = plan.premisesType === 'commercial' ? COMMERCIAL_ROOMS : DOMESTIC_ROOMS;
  // Most of the demo uses 2k2 tamper / 4k7 alarm: 2.2 kΩ secure, 6.9 kΩ in alarm.
  const resistorPair = random.pick([
    [2200, 4700],
    [2200, 4700],
    [2200, 4700],
    [1000, 1000],
    [4700, 2200],
  ] as const);
  return Array.from({ length: plan.zones }, (_, index) => {
    const base = rooms[index % rooms.length]!;
    const location =
      index < rooms.length ? base : `${base} ${Math.floor(index / rooms.length) + 1}`;
    const isDoor = /door|shutter|patio|hatch|exit/i.test(location);
    const isHoldUp = /hold-up/i.test(location);
    const isShock = /vibration/i.test(location);
    const zoneType =
      index === 0
        ? 'entry_exit'
        : index === 1
          ? 'entry_route'
          : isHoldUp
            ? 'hold_up'
            : /fire exit/i.test(location)
              ? '24_hour'
              : 'instant';
    const detectorKind = isHoldUp
      ? 'hold_up_button'
      : isShock
        ? 'vibration'
        : isDoor
          ? 'magnetic_contact'
          : random.next() < 0.5
            ? 'dual_technology'
            : 'pir';
    const wiring = random.next() < 0.9 ? 'two_resistor' : 'closed_loop_separate_tamper';
    const powered =
      detectorKind === 'pir' || detectorKind === 'dual_technology' || detectorKind === 'vibration';
    const terminal = `Z${index + 1}`;
    return {
      number: index + 1,
      location,
      zoneType,
      detectorKind,
      loopWiring: wiring,
      tamperOhms: wiring === 'two_resistor' ? resistorPair[0] : null,
      alarmOhms: wiring === 'two_resistor' ? resistorPair[1] : null,
      coreMap: [
        ...(powered
          ? [
              { colour: 'red', terminal: '+12V' },
              { colour: 'black', terminal: '0V' },
            ]
          : []),
        { colour: 'white', terminal },
        { colour: 'yellow', terminal },
        ...(wiring === 'closed_loop_separate_tamper'
          ? [
              { colour: 'blue', terminal: 'T' },
              { colour: 'green', terminal: 'T' },
            ]
          : []),
      ],
      quiescentMa: powered ? (detectorKind === 'dual_technology' ? 15 : 10) : 0,
      alarmMa: powered ? (detectorKind === 'dual_technology' ? 25 : 15) : 0,
      attributes: index === 0 ? ['chime'] : index === 1 ? ['part_set'] : [],
    };
  });
}

export const KEYHOLDER_NAMES = [
  'Ruth Pelham',
  'Dev Okonjo',
  'Marta Varga',
  'Alun Quayle',
  'Ifeoma Osei',
  'Pieter Achterberg',
  'Carys Rowntree',
  'Noel Brannigan',
];

/** A one-page PDF (a survey note), small and valid, written by hand. */
export function demoPdf(title: string): Buffer {
  const text = title.replace(/[()\\]/g, '');
  const stream = `BT /F1 14 Tf 72 760 Td (${text}) Tj ET`;
  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    '<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>',
    `<< /Length ${stream.length} >>\nstream\n${stream}\nendstream`,
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>',
  ];
  let body = '%PDF-1.4\n';
  const offsets: number[] = [];
  objects.forEach((object, index) => {
    offsets.push(body.length);
    body += `${index + 1} 0 obj\n${object}\nendobj\n`;
  });
  const xref = body.length;
  body += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  body += offsets.map((offset) => `${String(offset).padStart(10, '0')} 00000 n \n`).join('');
  body += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(body, 'latin1');
}

/** A small brass-coloured PNG standing in for a site photo. */
export const DEMO_PHOTO = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAADAAAAAgCAIAAADbtmxLAAAAN0lEQVR4nO3OQQ0AMAgEMHRhEEmzNxccjyYV0HrTp1R8ICQkJJQeCAkJCaUHQkJCQumBkJDQsg+ufNB5Izx32QAAAABJRU5ErkJggg==',
  'base64',
);
