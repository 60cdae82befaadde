/** Formats a resistance as engineers say it: 470 Ω, 2.2 kΩ, 6.9 kΩ, 1.5 MΩ. */
export function formatOhms(ohms: number): string {
  if (ohms >= 1_000_000) return `${Number((ohms / 1_000_000).toPrecision(3))} MΩ`;
  if (ohms >= 1_000) return `${Number((ohms / 1_000).toPrecision(3))} kΩ`;
  return `${Math.round(ohms)} Ω`;
}

const multipliers: Record<string, number> = { r: 1, k: 1_000, m: 1_000_000 };

// Resistor code as printed on drawings and bags (IEC 60062): the letter stands for the decimal
// point and the multiplier, so 2k2 is 2.2 kΩ and 470R is 470 Ω.
const resistorCode = /^(\d*)([rkm])(\d*)$/i;
const withUnit = /^(\d+(?:\.\d+)?)\s*([km])?\s*(?:Ω|ohms?)?$/i;

/**
 * Reads a resistor value typed as ohms ("2200") or in resistor code ("2k2", "4K7", "470R",
 * "2.2k"). Empty means not recorded (null); anything unreadable comes back as NaN so the shared
 * schema explains what to type.
 */
export function parseOhms(value: unknown): number | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return value;
  // Commas are read as thousands separators ("2,200"), as written in the UK.
  const text = String(value).trim().replace(/,/g, '');
  if (text === '') return null;

  const code = resistorCode.exec(text);
  if (code && (code[1] || code[3])) {
    const [, whole = '', letter = 'r', fraction = ''] = code;
    const multiplier = multipliers[letter.toLowerCase()] ?? 1;
    // Rounded to the milliohm only to drop floating-point noise (2.2 × 1000); whether a value
    // is whole ohms is for the schema to say.
    return Math.round(Number(`${whole || '0'}.${fraction || '0'}`) * multiplier * 1000) / 1000;
  }
  const plain = withUnit.exec(text);
  if (plain) {
    const [, amount = '', prefix] = plain;
    const multiplier = prefix ? (multipliers[prefix.toLowerCase()] ?? 1) : 1;
    return Math.round(Number(amount) * multiplier * 1000) / 1000;
  }
  return Number.NaN;
}
