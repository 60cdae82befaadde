import { describe, expect, it } from 'vitest';
import { expectedReadings } from '../../src/features/zones/utils/expected-readings';
import { formatOhms, parseOhms } from '../../src/features/zones/utils/ohms';

describe('expected loop readings (nominal)', () => {
  // Two-resistor loop with 2.2 kΩ tamper (series) and 4.7 kΩ alarm (across the contact):
  // 2.2 kΩ secure, 2.2 + 4.7 = 6.9 kΩ in alarm (common practice, no source; ../shared/checks.md).
  it('reads 2.2 kΩ secure and 6.9 kΩ in alarm for a 2k2 / 4k7 two-resistor loop', () => {
    expect(expectedReadings('two_resistor', 2200, 4700)).toEqual({
      normal: '2.2 kΩ',
      alarm: '6.9 kΩ',
    });
  });

  // A 1 kΩ / 1 kΩ pair reads 1 kΩ secure and 2 kΩ in alarm (common practice, no source).
  it('reads 1 kΩ secure and 2 kΩ in alarm for a 1k / 1k pair', () => {
    expect(expectedReadings('two_resistor', 1000, 1000)).toEqual({ normal: '1 kΩ', alarm: '2 kΩ' });
  });

  it('opens a one-resistor or closed loop in alarm, and waits for missing values', () => {
    expect(expectedReadings('one_resistor', null, 4700)).toEqual({
      normal: '4.7 kΩ',
      alarm: 'open circuit',
    });
    expect(expectedReadings('closed_loop_separate_tamper', null, null)).toEqual({
      normal: 'closed (near 0 Ω)',
      alarm: 'open circuit',
    });
    expect(expectedReadings('two_resistor', 2200, null)).toBeNull();
    expect(expectedReadings(undefined, 2200, 4700)).toBeNull();
  });
});

describe('resistor values as engineers write them', () => {
  // IEC 60062 letter-and-digit code: the letter marks the decimal point and the multiplier
  // (R = ×1, k = ×10³, M = ×10⁶), so 2k2 = 2200 Ω, 4k7 = 4700 Ω, 470R = 470 Ω, 1M = 1 MΩ.
  it.each([
    ['2k2', 2200],
    ['4K7', 4700],
    ['6k8', 6800],
    ['470R', 470],
    ['1M', 1_000_000],
    ['0R5', 0.5],
    ['2.2k', 2200],
    ['2200', 2200],
    ['2,200', 2200],
    ['4.7 kΩ', 4700],
    ['', null],
  ])('reads %s as %s Ω', (typed, ohms) => {
    expect(parseOhms(typed)).toBe(ohms);
  });

  it('gives NaN for what is not a resistor value, so the form can explain', () => {
    expect(parseOhms('two point two')).toBeNaN();
    expect(parseOhms('2k2k')).toBeNaN();
  });

  it('says values the way they are spoken', () => {
    expect(formatOhms(470)).toBe('470 Ω');
    expect(formatOhms(2200)).toBe('2.2 kΩ');
    expect(formatOhms(6900)).toBe('6.9 kΩ');
    expect(formatOhms(1_500_000)).toBe('1.5 MΩ');
  });
});
