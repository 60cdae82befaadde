/**
 * False alarms against a site's police response, counted over a rolling twelve months. Under the
 * NPCC policy on police response to security systems (../shared/checks.md), an intruder alarm
 * gets a warning after two false calls in a rolling twelve months and loses police response after
 * three. Pure: the caller supplies the dates of the false calls.
 */
export type PoliceResponseStanding = 'in_good_standing' | 'warning' | 'withdrawal_due';

export const WARNING_AFTER = 2;
export const WITHDRAWAL_AFTER = 3;

export interface FalseAlarmCount {
  count: number;
  standing: PoliceResponseStanding;
  /** When the oldest counted false alarm leaves the window, lowering the count. */
  oldestDropsOffAt: Date | null;
}

/** The same day and month a year before, in UTC (29 February falls back to 28th). */
function yearBefore(now: Date): Date {
  const date = new Date(now);
  date.setUTCFullYear(date.getUTCFullYear() - 1);
  if (date.getUTCMonth() !== now.getUTCMonth()) date.setUTCDate(0);
  return date;
}

export function countFalseAlarms(falseAlarmTimes: readonly Date[], now: Date): FalseAlarmCount {
  const since = yearBefore(now);
  const counted = falseAlarmTimes
    .filter((time) => time > since && time <= now)
    .sort((a, b) => a.getTime() - b.getTime());
  const count = counted.length;
  const standing: PoliceResponseStanding =
    count >= WITHDRAWAL_AFTER
      ? 'withdrawal_due'
      : count >= WARNING_AFTER
        ? 'warning'
        : 'in_good_standing';
  const oldest = counted[0];
  let oldestDropsOffAt: Date | null = null;
  if (oldest) {
    oldestDropsOffAt = new Date(oldest);
    oldestDropsOffAt.setUTCFullYear(oldest.getUTCFullYear() + 1);
  }
  return { count, standing, oldestDropsOffAt };
}

/**
 * Whether the police may be asked to attend (NPCC policy): only for a site with a URN whose
 * response has not been withdrawn, and for intruder alarms only once confirmed (BS 8243).
 */
export function policeEligibility(
  event: { category: string; confirmed: boolean; status: string },
  site: { police_urn: string | null; urn_status: string } | null,
): { eligible: boolean; reason: string } {
  if (!site) return { eligible: false, reason: 'No site has this account.' };
  if (!site.police_urn || !['active', 'warning'].includes(site.urn_status))
    return {
      eligible: false,
      reason:
        site.urn_status === 'withdrawn'
          ? 'Police response to this site is withdrawn (NPCC policy): call keyholders.'
          : 'This site has no active police URN: call keyholders.',
    };
  if (event.category === 'hold_up')
    return { eligible: true, reason: 'Hold-up alarm at a site with a police URN.' };
  if (event.category === 'burglary' && event.confirmed)
    return { eligible: true, reason: 'Confirmed intruder alarm at a site with a police URN.' };
  if (event.category === 'burglary')
    return {
      eligible: false,
      reason:
        'Unconfirmed intruder alarm: police attend confirmed alarms only (sequential confirmation, BS 8243).',
    };
  return { eligible: false, reason: 'Police are requested for intruder and hold-up alarms only.' };
}
