import { z } from 'zod';

/**
 * The frozen record of every value a handover pack shows. It is built once from the site's
 * records when the pack is issued (or previewed), stored beside the sealed PDF, and is the
 * only input the PDF renderer reads — so a pack can always be explained from its snapshot.
 */

const band = z.object({
  state: z.enum(['short_circuit', 'normal', 'alarm', 'open_circuit']),
  /** null for the open band, whose nominal value is infinite. */
  nominalOhms: z.number().nullable(),
  lowOhms: z.number(),
  /** null stands for "no upper limit" (the open band): JSON has no Infinity. */
  highOhms: z.number().nullable(),
});
export type SnapshotBand = z.infer<typeof band>;

const loopState = z.enum(['normal', 'alarm', 'open_circuit', 'short_circuit', 'out_of_tolerance']);

const snapshotZone = z.object({
  number: z.number(),
  location: z.string(),
  area: z.string().nullable(),
  zoneType: z.string(),
  detectorKind: z.string(),
  /** "Two-resistor loop 2K2 / 4K7", in the trade's notation. */
  wiring: z.string(),
  grade: z.number().nullable(),
  environmentalClass: z.number().nullable(),
  bands: z.array(band),
  expected: z.object({ normalOhms: z.number().nullable(), alarmOhms: z.number().nullable() }),
  measured: z
    .object({
      /** null when the meter read open (OL). */
      secureOhms: z.number().nullable(),
      secureState: loopState,
      alarmOhms: z.number().nullable(),
      alarmState: loopState.nullable(),
      activated: z.boolean(),
      passed: z.boolean(),
      testedAt: z.string(),
      testedBy: z.string().nullable(),
    })
    .nullable(),
  siting: z.enum(['all_clear', 'needs_attention', 'not_checked', 'not_applicable']),
});
export type SnapshotZone = z.infer<typeof snapshotZone>;

const signature = z.object({
  name: z.string(),
  /** A PNG data URL drawn on signature_pad. */
  image: z.string(),
  signedAt: z.string(),
});
export type SnapshotSignature = z.infer<typeof signature>;

export const packSnapshotSchema = z.object({
  version: z.literal(1),
  packNumber: z.string(),
  revision: z.number().int().min(1),
  /** The pack number this revision replaces, if any. */
  supersedes: z.string().nullable(),
  /** ISO date-time of issue; the preview carries the time it was drawn. */
  issuedAt: z.string(),
  preview: z.boolean(),
  /** The public verification page for this pack number (the QR code's target). */
  verifyUrl: z.string(),
  installer: z.object({
    name: z.string(),
    addressLines: z.array(z.string()),
    phone: z.string(),
    email: z.string(),
  }),
  site: z.object({
    reference: z.string(),
    name: z.string(),
    addressLines: z.array(z.string()),
    premisesType: z.enum(['domestic', 'commercial']),
    requiredGrade: z.number(),
    gradeRationale: z.string(),
    environmentalClass: z.number().nullable(),
    riskNotes: z.string(),
    hazards: z.string(),
  }),
  system: z.object({
    controlPanel: z.string(),
    firmware: z.string(),
    panelLocation: z.string(),
    psuType: z.string().nullable(),
    batteryAh: z.number().nullable(),
    /** PD 6662 / EN 50131 notification option A–F. */
    notification: z.string().nullable(),
    grade: z.number().nullable(),
    gradeLimitedBy: z.array(z.string()),
    standards: z.array(z.string()),
    signallingPaths: z.array(
      z.object({ bearer: z.string(), atsCategory: z.string(), description: z.string() }),
    ),
  }),
  zones: z.array(snapshotZone),
  devices: z.array(
    z.object({
      kind: z.string(),
      location: z.string(),
      grade: z.number().nullable(),
      environmentalClass: z.number().nullable(),
    }),
  ),
  power: z.discriminatedUnion('available', [
    z.object({
      available: z.literal(true),
      standbyHours: z.number(),
      standbySource: z.string(),
      alarmMinutes: z.number(),
      quiescentMa: z.number(),
      alarmMa: z.number(),
      ageingFactor: z.number(),
      requiredAh: z.number(),
      batteryAh: z.number().nullable(),
      passes: z.boolean().nullable(),
      /** The formula with the site's numbers in, e.g. "(0.125 A × 12 h + …) × 1.25". */
      working: z.string(),
      items: z.array(z.object({ label: z.string(), quiescentMa: z.number(), alarmMa: z.number() })),
    }),
    z.object({ available: z.literal(false), reason: z.string() }),
  ]),
  tests: z.object({
    sounders: z
      .object({ passed: z.boolean(), testedAt: z.string(), summary: z.string() })
      .nullable(),
    signalling: z
      .object({ passed: z.boolean(), testedAt: z.string(), summary: z.string() })
      .nullable(),
    battery: z
      .object({ passed: z.boolean(), testedAt: z.string(), summary: z.string() })
      .nullable(),
  }),
  keyholders: z.array(
    z.object({
      position: z.number(),
      name: z.string(),
      phone: z.string(),
      attendMinutes: z.number().nullable(),
    }),
  ),
  /** User-code slots: who holds which slot. Codes themselves are never recorded. */
  userSlots: z.array(z.object({ slot: z.number(), holder: z.string(), level: z.number() })),
  monitoring: z
    .object({
      centreName: z.string(),
      accountNumber: z.string().nullable(),
      policeUrn: z.string().nullable(),
      urnStatus: z.string(),
    })
    .nullable(),
  servicePlan: z.object({
    visitsPerYear: z.number(),
    nextVisitDue: z.string(),
    basis: z.string(),
  }),
  /** Blocking problems the customer accepted in writing instead of a clear pre-issue check. */
  variations: z.array(
    z.object({
      text: z.string(),
      /** When the customer signed to accept it; null in a preview before they have. */
      acceptedAt: z.string().nullable(),
    }),
  ),
  /** null only in a preview drawn before signing. */
  engineer: signature.nullable(),
  customer: signature.nullable(),
});
export type PackSnapshot = z.infer<typeof packSnapshotSchema>;
