import { describe, expect, it } from 'vitest';
import { reinstatement } from '../../server/calc/reinstatement';

// NPCC policy on police response (../shared/checks.md): response withdrawn for false alarms is
// reinstated after remedial work, or after 3 months free of false calls.
const visit = (id: string, doneOn: string) => ({
  id,
  doneOn,
  cause: 'A spider on the hall detector',
  actionTaken: 'Cleaned and sealed the detector',
});

describe('reinstating police response', () => {
  it('is met by remedial work done after the last false alarm', () => {
    const result = reinstatement({
      falseAlarmDates: ['2026-10-01', '2026-11-20', '2026-11-02'],
      remedialVisits: [visit('v1', '2026-11-22')],
      today: '2026-12-02',
    });
    expect(result).toMatchObject({
      lastFalseAlarmOn: '2026-11-20',
      clearOn: '2027-02-20',
      remedialVisitId: 'v1',
      met: true,
    });
    expect(result.items).toEqual([
      {
        item: 'remedial_work',
        met: true,
        words:
          'Remedial work done on 2026-11-22: Cleaned and sealed the detector (cause found: A spider on the hall detector).',
      },
      {
        item: 'three_months_clear',
        met: false,
        words:
          'The last false alarm was on 2026-11-20: three months free of them are up on 2027-02-20.',
      },
    ]);
  });

  it('does not count work done before a later false alarm', () => {
    const result = reinstatement({
      falseAlarmDates: ['2026-11-20'],
      remedialVisits: [visit('early', '2026-11-19')],
      today: '2026-12-02',
    });
    expect(result.met).toBe(false);
    expect(result.remedialVisitId).toBeNull();
    expect(result.items[0].words).toBe(
      'No call-out since the last false alarm (2026-11-20) has recorded the cause and the work done.',
    );
  });

  it('is met three calendar months on, from the day itself (month ends fall back)', () => {
    const facts = { falseAlarmDates: ['2026-11-30'], remedialVisits: [] };
    // 30 November + 3 months = 28 February (2027 is not a leap year).
    expect(reinstatement({ ...facts, today: '2027-02-27' }).met).toBe(false);
    const clear = reinstatement({ ...facts, today: '2027-02-28' });
    expect(clear).toMatchObject({ clearOn: '2027-02-28', met: true });
    expect(clear.items[1].words).toBe(
      'Free of false alarms since 2026-11-30: three months were up on 2027-02-28.',
    );
  });

  it('has nothing to wait for when no false alarm is recorded', () => {
    const result = reinstatement({ falseAlarmDates: [], remedialVisits: [], today: '2026-12-02' });
    expect(result).toMatchObject({ lastFalseAlarmOn: null, clearOn: null, met: true });
    expect(result.items[1].words).toBe('No false alarm is recorded.');
  });
});
