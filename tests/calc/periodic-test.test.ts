import { describe, expect, it } from 'vitest';
import { graceMinutes, isTestOverdue, testDueBy } from '../../server/calc/periodic-test';

describe('when a periodic test is overdue', () => {
  // The grace: 10 % of the interval, at least 5 minutes (common practice, no source).
  it('allows 10 % of the interval as grace, never less than 5 minutes', () => {
    expect(graceMinutes(5)).toBe(5);
    expect(graceMinutes(30)).toBe(5);
    expect(graceMinutes(50)).toBe(5);
    expect(graceMinutes(60)).toBe(6);
    expect(graceMinutes(65)).toBe(7);
    expect(graceMinutes(1440)).toBe(144);
    expect(graceMinutes(10080)).toBe(1008);
  });

  it('counts a test missed only after the interval and the grace have both passed', () => {
    const last = new Date('2026-12-06T09:00:00Z');
    expect(testDueBy(last, 1440)).toEqual(new Date('2026-12-07T11:24:00Z'));
    expect(isTestOverdue(last, 1440, new Date('2026-12-07T11:24:00Z'))).toBe(false);
    expect(isTestOverdue(last, 1440, new Date('2026-12-07T11:24:01Z'))).toBe(true);
    expect(isTestOverdue(last, 60, new Date('2026-12-06T10:05:59Z'))).toBe(false);
    expect(isTestOverdue(last, 60, new Date('2026-12-06T10:06:01Z'))).toBe(true);
  });
});
