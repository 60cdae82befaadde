/**
 * When a panel's periodic test (Contact ID 602, SIA RP) is overdue. Pure: the caller supplies the
 * last time the site was heard from, the interval the centre expects, and the time now.
 *
 * The grace is 10 % of the interval, at least 5 minutes, so a test sent a little late (a panel
 * clock drifting, a retry over a slow path) does not raise a fault (common practice, no source).
 */
export const GRACE_FRACTION = 0.1;
export const MIN_GRACE_MINUTES = 5;

export function graceMinutes(intervalMinutes: number): number {
  return Math.max(MIN_GRACE_MINUTES, Math.ceil(intervalMinutes * GRACE_FRACTION));
}

/** The moment after which a test counts as missed. */
export function testDueBy(lastHeardAt: Date, intervalMinutes: number): Date {
  return new Date(
    lastHeardAt.getTime() + (intervalMinutes + graceMinutes(intervalMinutes)) * 60_000,
  );
}

export function isTestOverdue(lastHeardAt: Date, intervalMinutes: number, now: Date): boolean {
  return now.getTime() > testDueBy(lastHeardAt, intervalMinutes).getTime();
}
