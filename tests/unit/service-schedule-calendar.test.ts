import { describe, expect, it } from 'vitest';
import {
  formatLongDay,
  monthRange,
  monthWeeks,
  parseMonth,
  shiftMonth,
  ukDayOf,
  ukTimeOf,
  ukToday,
  ukWallTimeToInstant,
} from '../../src/features/service/utils/uk-calendar';
import {
  bookVisitFormSchema,
  emptyBooking,
  moveFormValuesOf,
  moveVisitFormSchema,
  toBookingInput,
  toMoveInput,
} from '../../src/features/service/utils/visit-form-values';
import {
  readScheduleView,
  scheduleSearchParams,
} from '../../src/features/service/utils/schedule-view';
import { isPastDue, visitDay } from '../../src/features/service/utils/visit-words';

// UK clock changes: British Summer Time runs from 01:00 GMT on the last Sunday in March to
// 01:00 GMT on the last Sunday in October (Summer Time Order 2002, from memory). The instants
// below were checked with GNU date 9.1 and the IANA tz database's Europe/London zone:
//   date -u -d 'TZ="Europe/London" 2027-03-29 09:30'   → 2027-03-29T08:30:00Z
describe('UK wall-clock times and instants', () => {
  it('turns a UK day and time into the instant, either side of both clock changes in 2027', () => {
    expect(ukWallTimeToInstant('2027-03-27', '09:30')).toBe('2027-03-27T09:30:00.000Z');
    expect(ukWallTimeToInstant('2027-03-29', '09:30')).toBe('2027-03-29T08:30:00.000Z');
    expect(ukWallTimeToInstant('2027-10-30', '09:30')).toBe('2027-10-30T08:30:00.000Z');
    expect(ukWallTimeToInstant('2027-11-01', '09:30')).toBe('2027-11-01T09:30:00.000Z');
    // Half past midnight on 1 July (BST) is still 30 June in UTC.
    expect(ukWallTimeToInstant('2027-07-01', '00:30')).toBe('2027-06-30T23:30:00.000Z');
  });

  it('reads an instant back as the UK day and time it was booked for', () => {
    expect(ukDayOf('2027-06-30T23:30:00.000Z')).toBe('2027-07-01');
    expect(ukTimeOf('2027-06-30T23:30:00.000Z')).toBe('00:30');
    expect(ukTimeOf('2027-01-15T00:05:00.000Z')).toBe('00:05');
    expect(ukToday(new Date('2027-03-31T23:30:00Z'))).toBe('2027-04-01');
    expect(ukToday(new Date('2027-12-31T23:30:00Z'))).toBe('2027-12-31');
  });

  it('refuses anything that is not a date and a 24-hour time', () => {
    expect(() => ukWallTimeToInstant('2027-03-29', '9.30')).toThrow(RangeError);
    expect(() => ukWallTimeToInstant('29/03/2027', '09:30')).toThrow(RangeError);
  });
});

// Weekdays checked with GNU date 9.1: `date -d 2027-03-01 +%A` → Monday; 2028-02-01 → Tuesday;
// 2026-11-01 → Sunday. 2028 is a leap year (Gregorian rule, divisible by 4 and not by 100).
describe('the month calendar', () => {
  it('lays March 2027 out from Monday 1st with no days borrowed from February', () => {
    const weeks = monthWeeks('2027-03');
    expect(weeks[0]).toEqual([
      '2027-03-01',
      '2027-03-02',
      '2027-03-03',
      '2027-03-04',
      '2027-03-05',
      '2027-03-06',
      '2027-03-07',
    ]);
    expect(weeks).toHaveLength(5);
    expect(weeks[4]).toEqual(['2027-03-29', '2027-03-30', '2027-03-31', null, null, null, null]);
  });

  it('starts November 2026 on a Sunday, in the last column, and takes six rows', () => {
    const weeks = monthWeeks('2026-11');
    expect(weeks[0]).toEqual([null, null, null, null, null, null, '2026-11-01']);
    expect(weeks).toHaveLength(6);
    expect(weeks.flat().filter(Boolean)).toHaveLength(30);
  });

  it('gives February 2028 its leap day, a Tuesday start and the range the API is asked for', () => {
    const weeks = monthWeeks('2028-02');
    expect(weeks[0]?.slice(0, 2)).toEqual([null, '2028-02-01']);
    expect(weeks.flat().filter(Boolean).at(-1)).toBe('2028-02-29');
    expect(monthRange('2028-02')).toEqual({ from: '2028-02-01', to: '2028-02-29' });
    expect(monthRange('2027-02')).toEqual({ from: '2027-02-01', to: '2027-02-28' });
    expect(formatLongDay('2028-02-29')).toBe('Tuesday 29 February 2028');
  });

  it('steps across year ends and reads only well-formed months from the address bar', () => {
    expect(shiftMonth('2027-12', 1)).toBe('2028-01');
    expect(shiftMonth('2027-01', -1)).toBe('2026-12');
    expect(parseMonth('2027-13')).toBeUndefined();
    expect(parseMonth('2027-3')).toBeUndefined();
    expect(parseMonth('2027-03')).toBe('2027-03');
  });
});

// Wardbook's own rules for the schedule screens; no outside source applies.
describe('the schedule’s address bar', () => {
  it('falls back to this month and the list for hand-edited values, and writes back only changes', () => {
    const view = readScheduleView(
      new URLSearchParams('month=2027-99&view=grid&engineer=not-an-id&visit=x'),
      '2027-03-10',
    );
    expect(view).toEqual({
      month: '2027-03',
      layout: 'list',
      engineerId: undefined,
      visitId: undefined,
      bookSiteId: undefined,
    });
    expect(scheduleSearchParams(view, '2027-03-10').toString()).toBe('');
    const engineerId = '5b0c4f0e-3d1e-4a57-9f4e-2f8a1c0d9e11';
    expect(
      scheduleSearchParams(
        { ...view, month: '2027-04', layout: 'calendar', engineerId },
        '2027-03-10',
      ).toString(),
    ).toBe(`month=2027-04&view=calendar&engineer=${engineerId}`);
  });

  it('files a visit under its booked UK day, or its due date while it has none', () => {
    expect(visitDay({ scheduledFor: '2027-06-30T23:30:00.000Z', dueDate: '2027-06-01' })).toBe(
      '2027-07-01',
    );
    expect(visitDay({ scheduledFor: null, dueDate: '2027-06-01' })).toBe('2027-06-01');
    expect(isPastDue({ status: 'scheduled', dueDate: '2027-03-09' }, '2027-03-10')).toBe(true);
    expect(isPastDue({ status: 'done', dueDate: '2027-03-09' }, '2027-03-10')).toBe(false);
  });
});

describe('the booking and move forms', () => {
  it('asks for the time with the day, a site, and the fault on a call-out', () => {
    const result = bookVisitFormSchema.safeParse({
      ...emptyBooking(),
      kind: 'corrective',
      day: '2027-03-10',
    });
    expect(result.success).toBe(false);
    const messages = Object.fromEntries(
      result.error!.issues.map((issue) => [issue.path.join('.'), issue.message]),
    );
    expect(messages).toEqual({
      siteId: 'Choose the site to visit.',
      time: 'Give the time the engineer is expected, e.g. 09:30.',
      reportedFault: 'Say what fault was reported.',
    });
  });

  it('sends the booked time as a UK instant, with the key made for this booking', () => {
    const key = '0d6f2f8e-8a4b-4c1e-9b7a-3f2e1d0c9b8a';
    expect(
      toBookingInput(
        {
          ...emptyBooking('site-1'),
          day: '2027-07-01',
          time: '00:30',
          engineerId: 'engineer-1',
          reportedFault: 'typed before switching to preventive',
        },
        key,
      ),
    ).toEqual({
      kind: 'preventive',
      scheduledFor: '2027-06-30T23:30:00.000Z',
      engineerId: 'engineer-1',
      clientKey: key,
    });
  });

  it('sends only what changed when a visit is moved, and nothing when nothing did', () => {
    const visit = {
      id: 'v',
      siteId: 's',
      siteReference: 'S-0001',
      siteName: 'Test',
      siteTown: 'Eastmere',
      kind: 'preventive' as const,
      status: 'scheduled' as const,
      dueDate: '2027-03-01',
      scheduledFor: '2027-03-29T08:30:00.000Z',
      engineer: { id: 'e1', name: 'Engineer One' },
      planVisitsPerYear: 2,
      reportedFault: null,
      completedAt: null,
      version: 4,
    };
    const saved = moveFormValuesOf(visit);
    expect(saved).toEqual({ engineerId: 'e1', day: '2027-03-29', time: '09:30', version: 4 });
    expect(toMoveInput(saved, saved)).toBeNull();
    expect(toMoveInput({ ...saved, day: '2027-03-31' }, saved)).toEqual({
      version: 4,
      scheduledFor: '2027-03-31T08:30:00.000Z',
    });
    expect(toMoveInput({ ...saved, engineerId: '' }, saved)).toEqual({
      version: 4,
      engineerId: null,
    });
    expect(toMoveInput({ ...saved, day: '', time: '' }, saved)).toEqual({
      version: 4,
      scheduledFor: null,
    });
    expect(moveVisitFormSchema.safeParse({ ...saved, day: '' }).error?.issues[0]?.message).toBe(
      'Give the day of the visit as well as the time.',
    );
  });
});
