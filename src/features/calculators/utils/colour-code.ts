import { DIGIT_COLOURS } from '@server/calc/preferred-values';

/* What each IEC 60062 colour band means, in words, and the sum a set of bands spells. */

const MULTIPLIER_EXPONENTS: Record<string, number> = { gold: -1, silver: -2 };
const TOLERANCES: Record<string, string> = {
  brown: '±1 %',
  red: '±2 %',
  green: '±0.5 %',
  blue: '±0.25 %',
  gold: '±5 %',
  silver: '±10 %',
};

const SUPERSCRIPTS: Record<string, string> = {
  '-': '⁻',
  '0': '⁰',
  '1': '¹',
  '2': '²',
  '3': '³',
  '4': '⁴',
  '5': '⁵',
  '6': '⁶',
  '7': '⁷',
  '8': '⁸',
  '9': '⁹',
};

/** 10², 10⁻¹: a power of ten as it is printed. */
const tenToThe = (exponent: number) =>
  `10${[...String(exponent)].map((character) => SUPERSCRIPTS[character] ?? character).join('')}`;

const digitOf = (colour: string) => DIGIT_COLOURS.indexOf(colour as (typeof DIGIT_COLOURS)[number]);

function multiplierWords(colour: string): string {
  const exponent = MULTIPLIER_EXPONENTS[colour] ?? digitOf(colour);
  return `× ${tenToThe(exponent)} (× ${Number((10 ** exponent).toPrecision(3)).toLocaleString('en-GB')})`;
}

export function meaningOf(
  colour: string,
  position: number,
  count: number,
): { role: string; value: string } {
  const digitBands = count - 2;
  if (position < digitBands) {
    return { role: `Digit ${position + 1}`, value: String(digitOf(colour)) };
  }
  if (position === digitBands) return { role: 'Multiplier', value: multiplierWords(colour) };
  return { role: 'Tolerance', value: TOLERANCES[colour] ?? '' };
}

/** The sum the bands spell: "22 × 10² = 2,200 Ω". */
export function colourWorking(bands: readonly string[]): string {
  const digitBands = bands.length - 2;
  const digits = bands.slice(0, digitBands).map(digitOf).join('');
  const multiplier = bands[digitBands] ?? 'black';
  const exponent = MULTIPLIER_EXPONENTS[multiplier] ?? digitOf(multiplier);
  const ohms = Number((Number(digits) * 10 ** exponent).toPrecision(6));
  return `${bands.join('-')}: ${digits} × ${tenToThe(exponent)} = ${ohms.toLocaleString('en-GB')} Ω, ${TOLERANCES[bands.at(-1) ?? ''] ?? ''}`;
}
