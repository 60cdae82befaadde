import { readingSchema } from '@server/calculators/schema';
import { coreOhmsPerMetre, runLoopOhms, type CoreBuild } from '@server/calc/cable';
import {
  STATE_NAMES,
  UNKNOWN_CABLE_OHMS,
  type BandState,
  type LoopDesign,
  type LoopState,
  type LoopWiring,
} from '@server/calc/loop';

/*
 * Loop figures for the browser: the same calculation module the API uses (server/calc), fed
 * from what is on the form, so expected readings follow every keystroke. The API stays the
 * authority when a record is saved.
 */

export type CableCore = '7/0.2' | '16/0.2';

/** Core builds by their trade names: seven or sixteen strands of 0.2 mm copper. */
export const CABLE_CORE_BUILDS: Record<CableCore, CoreBuild> = {
  '7/0.2': { strands: 7, strandDiameterMm: 0.2 },
  '16/0.2': { strands: 16, strandDiameterMm: 0.2 },
};

/** The system-wide settings a zone's expected readings depend on. */
export type LoopSettings = { resistorTolerance: number; cableCore: CableCore };

/** Cable temperatures the allowance spans, as the API uses (common practice, no source). */
export const CABLE_TEMPERATURE_SPAN_C = { min: 0, max: 40 } as const;

/**
 * The cable's share of a zone's readings: from its recorded run across 0–40 °C, or the general
 * allowance when the run is not recorded. Mirrors the API's own calculation for the zone.
 */
export function zoneCableOhms(
  cableMetres: number | null,
  coresPerLeg: number,
  cableCore: CableCore,
): { min: number; max: number } {
  if (cableMetres === null || !Number.isFinite(cableMetres) || cableMetres < 0) {
    return UNKNOWN_CABLE_OHMS;
  }
  const legs = Number.isInteger(coresPerLeg) && coresPerLeg >= 1 ? coresPerLeg : 1;
  const build = CABLE_CORE_BUILDS[cableCore];
  const at = (celsius: number) => runLoopOhms(cableMetres, coreOhmsPerMetre(build, celsius), legs);
  return { min: at(CABLE_TEMPERATURE_SPAN_C.min), max: at(CABLE_TEMPERATURE_SPAN_C.max) };
}

const positiveOrNull = (value: unknown): number | null =>
  typeof value === 'number' && Number.isFinite(value) && value > 0 ? value : null;

/** A zone's loop design from form values, which may still be half typed. */
export function zoneLoopDesign(
  zone: {
    loopWiring: LoopWiring;
    tamperOhms: unknown;
    alarmOhms: unknown;
    cableMetres: unknown;
    coresPerLeg: unknown;
  },
  settings: LoopSettings,
): LoopDesign {
  const cableMetres =
    typeof zone.cableMetres === 'number' && Number.isFinite(zone.cableMetres)
      ? zone.cableMetres
      : null;
  const coresPerLeg = typeof zone.coresPerLeg === 'number' ? zone.coresPerLeg : 1;
  return {
    wiring: zone.loopWiring,
    tamperOhms: positiveOrNull(zone.tamperOhms),
    alarmOhms: positiveOrNull(zone.alarmOhms),
    tolerance: settings.resistorTolerance,
    cableOhms: zoneCableOhms(cableMetres, coresPerLeg, settings.cableCore),
  };
}

/** 470 Ω, 2.2 kΩ, 6.9 kΩ, 1.5 MΩ; a meter's OL for an open circuit. */
export function formatOhms(ohms: number, significant = 3): string {
  if (!Number.isFinite(ohms)) return 'OL (open)';
  if (ohms >= 1_000_000) return `${Number((ohms / 1_000_000).toPrecision(significant))} MΩ`;
  if (ohms >= 1_000) return `${Number((ohms / 1_000).toPrecision(significant))} kΩ`;
  return `${Number(ohms.toPrecision(significant))} Ω`;
}

/**
 * A band's edges in one unit, the upper edge's, so a range reads short: "2.09–2.34 kΩ". An
 * open-ended band (null or Infinity above) reads "over 14 kΩ".
 */
export function formatOhmsRange(fromOhms: number, toOhms: number | null): string {
  if (toOhms === null || !Number.isFinite(toOhms)) return `over ${formatOhms(fromOhms)}`;
  const [divisor, unit] =
    toOhms >= 1_000_000 ? [1_000_000, 'MΩ'] : toOhms >= 1_000 ? [1_000, 'kΩ'] : [1, 'Ω'];
  const scaled = (ohms: number) => Number((ohms / divisor).toPrecision(3));
  return `${scaled(fromOhms)}–${scaled(toOhms)} ${unit}`;
}

/** A band as it travels from the API (null for open-ended) or comes from the calc module. */
export type BandLike = {
  state: BandState;
  lowOhms: number;
  highOhms: number | null;
  nominalOhms?: number | null;
};

/** "Normal 2.09–2.34 kΩ", "Open circuit over 14 kΩ". */
export function describeBand(band: BandLike): string {
  return `${STATE_NAMES[band.state]} ${formatOhmsRange(band.lowOhms, band.highOhms)}`;
}

export function bandOf(bands: readonly BandLike[], state: BandState): BandLike | undefined {
  return bands.find((band) => band.state === state);
}

export type GaugeState = 'short' | 'normal' | 'alarm' | 'open';

const GAUGE_STATES: Record<BandState, GaugeState> = {
  short_circuit: 'short',
  normal: 'normal',
  alarm: 'alarm',
  open_circuit: 'open',
};

/** The loop gauge's bands from the calculation's bands. */
export function toGaugeBands(bands: readonly BandLike[]) {
  return bands.map((band) => ({
    state: GAUGE_STATES[band.state],
    fromOhms: band.lowOhms,
    toOhms: band.highOhms === null || !Number.isFinite(band.highOhms) ? null : band.highOhms,
  }));
}

/** The loop gauge's word for a classified state. */
export function toGaugeState(state: LoopState): GaugeState | 'out-of-tolerance' {
  return state === 'out_of_tolerance' ? 'out-of-tolerance' : GAUGE_STATES[state];
}

export type ParsedReading =
  { status: 'empty' } | { status: 'ok'; ohms: number } | { status: 'invalid'; message: string };

/**
 * A meter reading as typed on site (2210, 2k21, 2.21 kΩ, OL), read by the same rules as the
 * API, so the live check and the saved verdict never disagree about what was typed.
 */
export function parseReading(text: string | null | undefined): ParsedReading {
  if (text === null || text === undefined || text.trim() === '') return { status: 'empty' };
  const parsed = readingSchema.safeParse(text);
  if (parsed.success) return { status: 'ok', ohms: parsed.data };
  return {
    status: 'invalid',
    message: parsed.error.issues[0]?.message ?? 'That is not a reading.',
  };
}

/** How far inside its band a reading sits, or how far outside the nearest one, in words. */
export function describeMargin(state: LoopState, bandState: BandState, marginOhms: number | null) {
  if (marginOhms === null || !Number.isFinite(marginOhms)) return '';
  if (state === 'out_of_tolerance') {
    return `${formatOhms(marginOhms)} outside the ${STATE_NAMES[bandState].toLowerCase()} band, the nearest`;
  }
  return `${formatOhms(marginOhms)} inside the band's nearer edge`;
}
