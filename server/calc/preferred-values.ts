/**
 * Preferred resistor values and the colour code.
 *
 * The E12 and E24 series are the tables of IEC 60063 (they are not all what rounding
 * 10^(i/n) gives: 2.7, 3.3, 3.9, 4.7 and 8.2 in E12, and several E24 values, differ).
 */
export const E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2] as const;
export const E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
  6.2, 6.8, 7.5, 8.2, 9.1,
] as const;

export type PreferredSeries = 'E12' | 'E24';
const SERIES = { E12, E24 } as const;

function decade(ohms: number) {
  return Math.floor(Math.log10(ohms) + 1e-9);
}

/** The series values around one decade, e.g. 1 000 … 8 200 and the next decade's 10 000. */
function candidates(series: PreferredSeries, exponent: number): number[] {
  const base = 10 ** exponent;
  return [
    ...SERIES[series].map((mantissa) => round(mantissa * base)),
    round(SERIES[series][0] * base * 10),
    round((SERIES[series].at(-1)! * base) / 10),
  ];
}

const round = (value: number) => Math.round(value * 1e6) / 1e6;

/** The nearest value of the series, measured as a ratio (what tolerance is), not a difference. */
export function nearestPreferred(ohms: number, series: PreferredSeries): number {
  if (!(ohms > 0) || !Number.isFinite(ohms))
    throw new RangeError('a positive resistance is needed');
  let best = Number.NaN;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (const value of candidates(series, decade(ohms))) {
    const distance = Math.abs(Math.log(ohms / value));
    if (distance < bestDistance) {
      best = value;
      bestDistance = distance;
    }
  }
  return best;
}

export function isPreferred(ohms: number, series: PreferredSeries): boolean {
  return ohms > 0 && nearestPreferred(ohms, series) === round(ohms);
}

/** IEC 60062 colour code. */
export const DIGIT_COLOURS = [
  'black',
  'brown',
  'red',
  'orange',
  'yellow',
  'green',
  'blue',
  'violet',
  'grey',
  'white',
] as const;
export type BandColour = (typeof DIGIT_COLOURS)[number] | 'gold' | 'silver';

const MULTIPLIER_COLOURS: Record<number, BandColour> = {
  [-2]: 'silver',
  [-1]: 'gold',
  0: 'black',
  1: 'brown',
  2: 'red',
  3: 'orange',
  4: 'yellow',
  5: 'green',
  6: 'blue',
  7: 'violet',
  8: 'grey',
  9: 'white',
};

const TOLERANCE_COLOURS: Record<string, BandColour> = {
  '0.001': 'grey',
  '0.0025': 'blue',
  '0.005': 'green',
  '0.01': 'brown',
  '0.02': 'red',
  '0.05': 'gold',
  '0.1': 'silver',
};

export interface ColourBands {
  bands: BandColour[];
  digits: number[];
  multiplierExponent: number;
  tolerance: number;
}

/**
 * The colour bands for a value: four bands (two digits, multiplier, tolerance; gold ±5 % by
 * default) or five (three digits; brown ±1 % by default). 2.2 kΩ is red-red-red-gold.
 */
export function colourBands(
  ohms: number,
  count: 4 | 5,
  tolerance = count === 4 ? 0.05 : 0.01,
): ColourBands {
  const digitsWanted = count - 2;
  if (!(ohms > 0)) throw new RangeError('a positive resistance is needed');
  const exponent = decade(ohms) - (digitsWanted - 1);
  const significand = Math.round(ohms / 10 ** exponent);
  if (Math.abs(significand * 10 ** exponent - ohms) > ohms * 1e-9) {
    throw new RangeError(`${ohms} Ω needs more than ${digitsWanted} significant digits`);
  }
  const digits = String(significand).padStart(digitsWanted, '0').split('').map(Number);
  const multiplier = MULTIPLIER_COLOURS[exponent];
  const toleranceColour = TOLERANCE_COLOURS[String(tolerance)];
  if (!multiplier) throw new RangeError(`${ohms} Ω is outside the colour code's multipliers`);
  if (!toleranceColour) throw new RangeError(`no colour for a tolerance of ${tolerance}`);
  return {
    bands: [...digits.map((digit) => DIGIT_COLOURS[digit]!), multiplier, toleranceColour],
    digits,
    multiplierExponent: exponent,
    tolerance,
  };
}
