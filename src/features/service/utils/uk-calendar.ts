import { addCalendarMonths, daysBetween, daysInMonth } from '@server/calc/service-plan';

/**
 * The schedule's days are UK days, as the API counts them (server/service/repository.ts): a
 * visit booked for 00:30 on a summer morning belongs to that morning, whatever the time zone of
 * the browser that shows it.
 */
export const SCHEDULE_TIME_ZONE = 'Europe/London';

const MONTH_PATTERN = /^(\d{4})-(0[1-9]|1[0-2])$/;
const DATE_PATTERN = /^\d{4}-\d{2}-\d{2}$/;
const TIME_PATTERN = /^([01]\d|2[0-3]):([0-5]\d)$/;

// en-CA writes dates as YYYY-MM-DD; hourCycle h23 keeps midnight at 00, not 24.
const ukDateParts = new Intl.DateTimeFormat('en-CA', {
  timeZone: SCHEDULE_TIME_ZONE,
  year: 'numeric',
  month: '2-digit',
  day: '2-digit',
  hour: '2-digit',
  minute: '2-digit',
  second: '2-digit',
  hourCycle: 'h23',
});

function ukWallClock(instant: Date) {
  const parts = Object.fromEntries(
    ukDateParts.formatToParts(instant).map((part) => [part.type, part.value]),
  );
  return {
    date: `${parts.year}-${parts.month}-${parts.day}`,
    time: `${parts.hour}:${parts.minute}`,
    // The same wall-clock reading taken as if it were UTC, to measure the zone's offset.
    asUtcMs: Date.UTC(
      Number(parts.year),
      Number(parts.month) - 1,
      Number(parts.day),
      Number(parts.hour),
      Number(parts.minute),
      Number(parts.second),
    ),
  };
}

/** Today in the UK, as YYYY-MM-DD. */
export function ukToday(now: Date = new Date()): string {
  return ukWallClock(now).date;
}

/** The UK calendar day of an ISO 8601 instant. */
export function ukDayOf(isoInstant: string): string {
  return ukWallClock(new Date(isoInstant)).date;
}

/** The UK clock time (HH:MM, 24-hour) of an ISO 8601 instant. */
export function ukTimeOf(isoInstant: string): string {
  return ukWallClock(new Date(isoInstant)).time;
}

/**
 * The instant at which UK clocks read `date` `time`, as an ISO 8601 string in UTC. The office
 * types the time the engineer is expected on site; the browser's own zone does not come into it.
 */
export function ukWallTimeToInstant(date: string, time: string): string {
  const timeMatch = TIME_PATTERN.exec(time);
  if (!DATE_PATTERN.test(date) || !timeMatch)
    throw new RangeError(`Not a date and time: ${date} ${time}`);
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  const wallAsUtc = Date.UTC(year, month - 1, day, Number(timeMatch[1]), Number(timeMatch[2]));
  // Guess with the offset at the wall time read as UTC, then correct once with the offset at the
  // guessed instant: the two differ only within hours of a clock change.
  const offsetAt = (ms: number) => ukWallClock(new Date(ms)).asUtcMs - ms;
  const firstGuess = wallAsUtc - offsetAt(wallAsUtc);
  return new Date(wallAsUtc - offsetAt(firstGuess)).toISOString();
}

/** A month as YYYY-MM, or undefined for anything else (a hand-edited address, say). */
export function parseMonth(value: string | null | undefined): string | undefined {
  return value && MONTH_PATTERN.test(value) ? value : undefined;
}

export const monthOf = (date: string) => date.slice(0, 7);

export function shiftMonth(month: string, months: number): string {
  return monthOf(addCalendarMonths(`${month}-01`, months));
}

/** The first and last days of a month, the range the schedule asks the API for. */
export function monthRange(month: string): { from: string; to: string } {
  const [year, monthNumber] = month.split('-').map(Number) as [number, number];
  return {
    from: `${month}-01`,
    to: `${month}-${String(daysInMonth(year, monthNumber)).padStart(2, '0')}`,
  };
}

/**
 * The month laid out in weeks from Monday (the UK's first day of the week, as in ISO 8601), with
 * null for the days of the neighbouring months that fill the first and last weeks.
 */
export function monthWeeks(month: string): (string | null)[][] {
  const { from, to } = monthRange(month);
  // 1 January 2024 was a Monday; whole weeks since then put any day in its weekday column.
  const leadingDays = ((daysBetween('2024-01-01', from) % 7) + 7) % 7;
  const cells: (string | null)[] = Array.from({ length: leadingDays }, () => null);
  const dayCount = daysBetween(from, to) + 1;
  for (let day = 1; day <= dayCount; day++) cells.push(`${month}-${String(day).padStart(2, '0')}`);
  while (cells.length % 7 !== 0) cells.push(null);
  const weeks: (string | null)[][] = [];
  for (let start = 0; start < cells.length; start += 7) weeks.push(cells.slice(start, start + 7));
  return weeks;
}

export const WEEKDAYS = [
  { short: 'Mon', long: 'Monday' },
  { short: 'Tue', long: 'Tuesday' },
  { short: 'Wed', long: 'Wednesday' },
  { short: 'Thu', long: 'Thursday' },
  { short: 'Fri', long: 'Friday' },
  { short: 'Sat', long: 'Saturday' },
  { short: 'Sun', long: 'Sunday' },
] as const;

// Calendar dates are formatted as UTC midnights so the browser's zone cannot move them a day.
const monthTitleFormat = new Intl.DateTimeFormat('en-GB', {
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
});
const longDayFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'long',
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
});
const shortDayFormat = new Intl.DateTimeFormat('en-GB', {
  weekday: 'short',
  day: 'numeric',
  month: 'short',
  timeZone: 'UTC',
});

const utcMidnight = (date: string) => new Date(`${date}T00:00:00Z`);

/** "March 2027". */
export function formatMonth(month: string): string {
  return monthTitleFormat.format(utcMidnight(`${month}-01`));
}

/** "Tuesday 9 March 2027". */
export function formatLongDay(date: string): string {
  return longDayFormat.format(utcMidnight(date)).replace(',', '');
}

/** "Tue 9 Mar". */
export function formatShortDay(date: string): string {
  return shortDayFormat.format(utcMidnight(date)).replace(',', '');
}
