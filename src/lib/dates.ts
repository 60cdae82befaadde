const calendarDateFormat = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'short',
  year: 'numeric',
  timeZone: 'UTC',
});

/**
 * Formats a calendar date ("2026-01-05" → "5 Jan 2026"). It is read as UTC so that a date never
 * shifts by a day in time zones west of Greenwich.
 */
export function formatCalendarDate(isoDate: string): string {
  const date = new Date(`${isoDate.slice(0, 10)}T00:00:00Z`);
  return Number.isNaN(date.getTime()) ? isoDate : calendarDateFormat.format(date);
}

/** Today's date in the browser's own time zone, as YYYY-MM-DD. */
export function todayAsCalendarDate(now = new Date()): string {
  const month = String(now.getMonth() + 1).padStart(2, '0');
  const day = String(now.getDate()).padStart(2, '0');
  return `${now.getFullYear()}-${month}-${day}`;
}
