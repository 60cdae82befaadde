import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatOhms, parseResistance, toRkm } from '../../server/calc/notation';
import {
  colourBands,
  E12,
  E24,
  isPreferred,
  nearestPreferred,
} from '../../server/calc/preferred-values';

const ohms = (text: string) => {
  const parsed = parseResistance(text);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.ohms;
};

describe('resistor code (IEC 60062 letter-and-digit code)', () => {
  // IEC 60062: the letter stands in for the decimal point and gives the multiplier
  // (R = 1, K = 10³, M = 10⁶). Values from ../shared/checks.md and the issue.
  it.each([
    ['2K2', 2200],
    ['4k7', 4700],
    ['6K9', 6900],
    ['1M', 1_000_000],
    ['470R', 470],
    ['0R5', 0.5],
    ['1M5', 1_500_000],
    ['R47', 0.47],
    ['10K', 10_000],
  ])('reads %s as %d Ω', (text, expected) => {
    expect(ohms(text)).toBe(expected);
  });

  it.each([
    [2200, '2K2'],
    [4700, '4K7'],
    [6900, '6K9'],
    [1_000_000, '1M'],
    [470, '470R'],
    [0.5, '0R5'],
    [12_700, '12K7'],
  ])('writes %d Ω as %s', (value, code) => {
    expect(toRkm(value)).toBe(code);
  });

  it('reads numbers with units, and ohms written out', () => {
    expect(ohms('2200')).toBe(2200);
    expect(ohms('2,200 Ω')).toBe(2200);
    expect(ohms('2.2k')).toBe(2200);
    expect(ohms('2.2 kΩ')).toBe(2200);
    expect(ohms('4.7 kohm')).toBe(4700);
    expect(ohms('0.4')).toBe(0.4);
  });

  it.each([
    ['2.2', /ambiguous: write 2.2 kΩ \(2K2\) or 2.2 Ω \(2R2\)/],
    ['1m', /Lower-case m means milli/],
    ['-4700', /cannot be negative/],
    ['', /Enter a resistance/],
    ['four seven', /is not a resistance/],
    ['2K2K', /is not a resistance/],
    ['NaN', /is not a resistance/],
  ])('refuses %j with words naming what is accepted', (text, message) => {
    const parsed = parseResistance(text);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) expect(parsed.message).toMatch(message);
  });

  it('round-trips: reading back the code for a value gives the value (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 50_000_000 }), (value) => ohms(toRkm(value)) === value),
    );
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 99_999 }),
        fc.integer({ min: 0, max: 2 }),
        (digits, places) => {
          const value = digits / 10 ** places;
          return ohms(toRkm(value)) === value;
        },
      ),
    );
  });

  it('says values as engineers say them', () => {
    expect(formatOhms(2200)).toBe('2.2 kΩ');
    expect(formatOhms(6900)).toBe('6.9 kΩ');
    expect(formatOhms(470)).toBe('470 Ω');
    expect(formatOhms(Number.POSITIVE_INFINITY)).toBe('open (∞)');
  });
});

describe('preferred values (IEC 60063)', () => {
  // The E12 and E24 tables of IEC 60063, cross-checked against the values listed in
  // PySpice-org/PyResistorColorCode, PyResistorColorCode/ResistorColourCode.py.
  it('holds the E12 and E24 tables exactly, not a rounding formula', () => {
    expect([...E12]).toEqual([1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2]);
    expect([...E24]).toEqual([
      1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6,
      6.2, 6.8, 7.5, 8.2, 9.1,
    ]);
    // Rounding 10^(i/12) would give 2.6, 3.2, 3.8, 4.6 and 8.3 here: the table is the authority.
    const rounded = Array.from({ length: 12 }, (_, i) => Math.round(10 ** (i / 12) * 10) / 10);
    expect(rounded.filter((value, i) => value !== E12[i])).toEqual([2.6, 3.2, 3.8, 4.6, 8.3]);
  });

  it.each([
    [2300, 'E12', 2200],
    [2500, 'E12', 2700],
    [4900, 'E12', 4700],
    [4900, 'E24', 5100],
    [9600, 'E24', 10_000],
    [9500, 'E24', 9100],
    [95, 'E12', 100],
    [1040, 'E24', 1000],
  ] as const)('%d Ω → nearest %s value %d Ω', (value, series, expected) => {
    expect(nearestPreferred(value, series)).toBe(expected);
  });

  it('knows 2k2 and 4k7 are E12 values and 5k1 is only E24', () => {
    expect(isPreferred(2200, 'E12')).toBe(true);
    expect(isPreferred(4700, 'E12')).toBe(true);
    expect(isPreferred(5100, 'E12')).toBe(false);
    expect(isPreferred(5100, 'E24')).toBe(true);
  });
});

describe('colour bands (IEC 60062)', () => {
  // 2.2 kΩ = red-red-red-gold and 4.7 kΩ = yellow-violet-red-gold (../shared/checks.md);
  // digit colours black 0 … white 9, multiplier 10^digit with gold 10⁻¹ and silver 10⁻²,
  // tolerance gold ±5 %, brown ±1 % (as in PySpice-org/PyResistorColorCode).
  it.each([
    [2200, ['red', 'red', 'red', 'gold']],
    [4700, ['yellow', 'violet', 'red', 'gold']],
    [1000, ['brown', 'black', 'red', 'gold']],
    [470, ['yellow', 'violet', 'brown', 'gold']],
    [10, ['brown', 'black', 'black', 'gold']],
    [4.7, ['yellow', 'violet', 'gold', 'gold']],
  ])('%d Ω in four bands', (value, bands) => {
    expect(colourBands(value, 4).bands).toEqual(bands);
  });

  it.each([
    [2200, ['red', 'red', 'black', 'brown', 'brown']],
    [4700, ['yellow', 'violet', 'black', 'brown', 'brown']],
    [12_700, ['brown', 'red', 'violet', 'red', 'brown']],
  ])('%d Ω in five bands (±1 %)', (value, bands) => {
    expect(colourBands(value, 5).bands).toEqual(bands);
  });

  it('refuses a value that needs more digits than the bands have', () => {
    expect(() => colourBands(12_700, 4)).toThrow(/more than 2 significant digits/);
  });
});
