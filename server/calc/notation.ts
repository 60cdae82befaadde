/**
 * Resistance as engineers write it. Two forms are read:
 * - the IEC 60062 letter-and-digit ("RKM") code printed on drawings and bags, where the
 *   letter stands for the decimal point and the multiplier: 2K2 = 2.2 kΩ, 4k7 = 4.7 kΩ,
 *   470R = 470 Ω, 0R5 = 0.5 Ω, 1M = 1 MΩ, 1M5 = 1.5 MΩ;
 * - a number with an optional unit: 2200, 2200 Ω, 2.2k, 2.2 kΩ, 4.7 kohm, 1.5 MΩ.
 * A bare decimal such as "2.2" is refused: it is the classic slip for 2.2 kΩ, and a meter
 * on its kΩ range shows exactly that.
 */

export type ParsedResistance = { ok: true; ohms: number } | { ok: false; message: string };

export const ACCEPTED_FORMS =
  'ohms (2200), resistor code (2K2, 4k7, 470R, 0R5, 1M) or a value with its unit (2.2 kΩ)';

const LETTER_MULTIPLIERS: Record<string, number> = { R: 1, K: 1_000, M: 1_000_000 };
const RKM = /^(\d*)([RrKkM])(\d*)$/;
// A lower-case m after a digit is milli in SI ("1m", "1.5 mΩ"), never mega.
const MILLI = /\d\s*m(\d|$|\s*Ω|\s*ohm)/;
const WITH_UNIT = /^(\d+(?:\.\d+)?|\.\d+)\s*(k|K|M)?\s*(Ω|ohms?|Ohms?|R)?$/;

export function parseResistance(input: unknown): ParsedResistance {
  if (typeof input === 'number') {
    return Number.isFinite(input) && input >= 0
      ? { ok: true, ohms: input }
      : { ok: false, message: `Enter a resistance: ${ACCEPTED_FORMS}.` };
  }
  if (typeof input !== 'string' || input.trim() === '') {
    return { ok: false, message: `Enter a resistance: ${ACCEPTED_FORMS}.` };
  }
  // UK writing uses commas for thousands ("2,200"); spaces inside codes are typing slips.
  const text = input.trim().replace(/,/g, '');
  if (/^-/.test(text)) return { ok: false, message: 'A resistance cannot be negative.' };
  if (MILLI.test(text)) {
    return {
      ok: false,
      message: 'Lower-case m means milli. Write M for megohms, e.g. 1M or 1.5 MΩ.',
    };
  }

  const code = RKM.exec(text);
  if (code && (code[1] || code[3])) {
    const [, whole = '', letter = 'R', fraction = ''] = code;
    const value = Number(`${whole || '0'}.${fraction || '0'}`);
    return { ok: true, ohms: roundNoise(value * LETTER_MULTIPLIERS[letter.toUpperCase()]!) };
  }

  const plain = WITH_UNIT.exec(text);
  if (plain) {
    const [, amount = '', prefix, unit] = plain;
    const value = Number(amount);
    if (!prefix && !unit && amount.includes('.') && value >= 1 && value < 100) {
      return {
        ok: false,
        message: `"${text}" is ambiguous: write ${amount} kΩ (${toRkm(value * 1000)}) or ${amount} Ω (${toRkm(value)}).`,
      };
    }
    const multiplier = prefix ? LETTER_MULTIPLIERS[prefix.toUpperCase()]! : 1;
    return { ok: true, ohms: roundNoise(value * multiplier) };
  }
  return { ok: false, message: `"${text}" is not a resistance. Use ${ACCEPTED_FORMS}.` };
}

/** Drops floating-point noise (2.2 × 1000 = 2200.0000000000005) below a micro-ohm. */
function roundNoise(ohms: number): number {
  return Math.round(ohms * 1e6) / 1e6;
}

/**
 * The IEC 60062 code for a value: 2200 → "2K2", 470 → "470R", 0.5 → "0R5", 6900 → "6K9",
 * 1 000 000 → "1M". As many digits as the value needs, so the code reads back exactly.
 */
export function toRkm(ohms: number): string {
  if (!Number.isFinite(ohms) || ohms < 0) throw new RangeError(`not a resistance: ${ohms}`);
  const [letter, divisor] =
    ohms >= 1_000_000 ? ['M', 1_000_000] : ohms >= 1_000 ? ['K', 1_000] : ['R', 1];
  const scaled = roundNoise(ohms / divisor);
  const [whole, fraction = ''] = String(scaled).split('.');
  return `${whole}${letter}${fraction}`;
}

/** The value as it is said aloud: "470 Ω", "2.2 kΩ", "6.9 kΩ", "1.5 MΩ". */
export function formatOhms(ohms: number, significant = 3): string {
  if (ohms === Number.POSITIVE_INFINITY) return 'open (∞)';
  if (ohms >= 1_000_000) return `${Number((ohms / 1_000_000).toPrecision(significant))} MΩ`;
  if (ohms >= 1_000) return `${Number((ohms / 1_000).toPrecision(significant))} kΩ`;
  return `${Number(ohms.toPrecision(significant))} Ω`;
}
