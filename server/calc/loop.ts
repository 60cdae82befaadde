import { formatOhms } from './notation';

/**
 * The resistance a panel sees on a resistor-supervised zone, and what a reading means.
 *
 * - Two-resistor loop: the tamper resistor in series, the alarm resistor across the normally
 *   closed alarm contact. Secure reads the tamper resistor (2k2 → 2.2 kΩ); in alarm the contact
 *   opens and the two add (2.2 + 4.7 = 6.9 kΩ); a cut is an open circuit, a bridged cable a
 *   short circuit. (Common practice, no source.)
 * - One-resistor loop: one resistor in series with the contact; alarm and a cut both open it.
 * - Closed loop with separate tamper pair: no resistors; the alarm contact opens the loop and
 *   tamper is watched on its own pair.
 *
 * Every state is a band: the nominal value widened by the resistors' tolerance and by the
 * cable's resistance, which adds to every reading.
 */
export type LoopWiring = 'two_resistor' | 'one_resistor' | 'closed_loop_separate_tamper';
export type LoopState = 'normal' | 'alarm' | 'open_circuit' | 'short_circuit' | 'out_of_tolerance';
export type BandState = Exclude<LoopState, 'out_of_tolerance'>;

export interface LoopDesign {
  wiring: LoopWiring;
  tamperOhms: number | null;
  alarmOhms: number | null;
  /** Resistor tolerance as a fraction: 0.05 for ±5 % (gold band), 0.01 for ±1 %. */
  tolerance: number;
  /** The cable's share of every reading, known or as a range. */
  cableOhms: { min: number; max: number };
}

export interface Band {
  state: BandState;
  nominalOhms: number;
  lowOhms: number;
  /** Infinity for the open band. */
  highOhms: number;
}

/**
 * Readings within this much above the cable's own resistance count as a short; an open
 * circuit reads at least OPEN_FLOOR_OHMS (a meter's "OL"). Common practice, no source.
 */
export const SHORT_ALLOWANCE_OHMS = 10;
export const OPEN_FLOOR_OHMS = 100_000;

/** Default cable allowance when the run is not recorded: up to 30 Ω, about 190 m of 7/0.2. */
export const UNKNOWN_CABLE_OHMS = { min: 0, max: 30 };

export const STATE_NAMES: Record<LoopState, string> = {
  normal: 'Normal',
  alarm: 'Alarm',
  open_circuit: 'Open circuit',
  short_circuit: 'Short circuit',
  out_of_tolerance: 'Out of tolerance',
};

function resistorBand(state: BandState, ohms: number, design: LoopDesign): Band {
  return {
    state,
    nominalOhms: ohms + (design.cableOhms.min + design.cableOhms.max) / 2,
    lowOhms: ohms * (1 - design.tolerance) + design.cableOhms.min,
    highOhms: ohms * (1 + design.tolerance) + design.cableOhms.max,
  };
}

export interface LoopBands {
  bands: Band[];
  /** Design errors: bands that touch or overlap cannot be told apart by any panel. */
  problems: string[];
}

export function loopBands(design: LoopDesign): LoopBands {
  const problems: string[] = [];
  const need = (value: number | null, name: string): number | null => {
    if (value === null || !(value > 0) || !Number.isFinite(value)) {
      problems.push(`The ${name} resistor value is missing.`);
      return null;
    }
    return value;
  };
  const short: Band = {
    state: 'short_circuit',
    nominalOhms: design.cableOhms.min,
    lowOhms: 0,
    highOhms: design.cableOhms.max + SHORT_ALLOWANCE_OHMS,
  };
  const bands: Band[] = [];
  switch (design.wiring) {
    case 'two_resistor': {
      const tamper = need(design.tamperOhms, 'tamper (series)');
      const alarm = need(design.alarmOhms, 'alarm');
      if (tamper === null || alarm === null) return { bands: [], problems };
      bands.push(
        short,
        resistorBand('normal', tamper, design),
        resistorBand('alarm', tamper + alarm, design),
      );
      break;
    }
    case 'one_resistor': {
      const resistor = need(design.alarmOhms, 'end-of-line');
      if (resistor === null) return { bands: [], problems };
      bands.push(short, resistorBand('normal', resistor, design));
      break;
    }
    case 'closed_loop_separate_tamper':
      bands.push({
        state: 'normal',
        nominalOhms: design.cableOhms.min,
        lowOhms: 0,
        highOhms: design.cableOhms.max + SHORT_ALLOWANCE_OHMS,
      });
      break;
  }
  const highestFinite = Math.max(...bands.map((band) => band.highOhms));
  // On one-resistor and closed loops an opened contact and a cut cable read the same.
  bands.push({
    state: design.wiring === 'two_resistor' ? 'open_circuit' : 'alarm',
    nominalOhms: Number.POSITIVE_INFINITY,
    lowOhms: Math.max(OPEN_FLOOR_OHMS, highestFinite * 2),
    highOhms: Number.POSITIVE_INFINITY,
  });

  for (let index = 1; index < bands.length; index++) {
    const below = bands[index - 1]!;
    const above = bands[index]!;
    if (above.lowOhms <= below.highOhms) {
      problems.push(
        `${STATE_NAMES[below.state]} (up to ${formatOhms(below.highOhms)}) and ${STATE_NAMES[above.state].toLowerCase()} ` +
          `(from ${formatOhms(above.lowOhms)}) overlap: no panel could tell them apart. Choose resistors further apart, ` +
          'tighter-tolerance resistors, or a shorter cable run.',
      );
    }
  }
  return { bands, problems };
}

export interface Classification {
  state: LoopState;
  /** The band the reading falls in, or the nearest one when out of tolerance. */
  band: Band;
  /**
   * How far inside its band the reading sits (distance to the nearer edge), or for a reading
   * out of tolerance how far it is from the nearest band.
   */
  marginOhms: number;
}

/** What a measured reading (ohms; Infinity for a meter's "OL") means on this loop. */
export function classifyReading(design: LoopDesign, readingOhms: number): Classification {
  if (Number.isNaN(readingOhms) || readingOhms < 0)
    throw new RangeError('a reading is 0 Ω or more');
  const { bands, problems } = loopBands(design);
  if (bands.length === 0) throw new RangeError(problems.join(' '));
  for (const band of bands) {
    if (readingOhms >= band.lowOhms && readingOhms <= band.highOhms) {
      const marginOhms =
        band.highOhms === Number.POSITIVE_INFINITY
          ? readingOhms - band.lowOhms
          : Math.min(readingOhms - band.lowOhms, band.highOhms - readingOhms);
      return { state: band.state, band, marginOhms };
    }
  }
  let nearest = bands[0]!;
  let distance = Number.POSITIVE_INFINITY;
  for (const band of bands) {
    const away =
      readingOhms < band.lowOhms ? band.lowOhms - readingOhms : readingOhms - band.highOhms;
    if (away < distance) {
      nearest = band;
      distance = away;
    }
  }
  return { state: 'out_of_tolerance', band: nearest, marginOhms: distance };
}
