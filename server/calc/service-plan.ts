/**
 * A site's service plan: how many preventive visits a year its signalling calls for, when the
 * next one falls due and whether it is overdue. Pure: the caller supplies the facts (how the
 * system signals, when it went into service, the last preventive visit) and today's date.
 *
 * Dates are calendar dates ("YYYY-MM-DD", ISO 8601), never instants: a visit is due on a day,
 * and turning days into instants would let time zones move them.
 */

/** The rule, in the words of ../shared/checks.md; shown to people beside every plan. */
export const SERVICE_PLAN_RULE =
  '2 preventive visits a year for remotely monitored systems, 1 for audible-only';
/** Where the rule comes from, exactly as ../shared/checks.md records it: a recalled value. */
export const SERVICE_PLAN_SOURCE = 'from memory of PD 6662 / BS 9263 practice';

export type Signalling = 'remotely_monitored' | 'audible_only';
export type VisitsPerYear = 1 | 2;

export const SIGNALLING_LABELS: Record<Signalling, string> = {
  remotely_monitored: 'Remotely monitored',
  audible_only: 'Audible only',
};

/** How the system signals, as the site and system records hold it. */
export interface SignallingRecord {
  /** The site names a monitoring centre (sites.monitoring_centre_id). */
  monitoringCentreLinked: boolean;
  /** The recorded signalling paths (signalling_paths.to_monitoring_centre). */
  signallingPaths: readonly { toMonitoringCentre: boolean }[];
}

/**
 * Whether the system is remotely monitored, with the reason in plain words. Where the two
 * records disagree (a centre but no path to it, or a path to a centre but none named) the plan
 * takes the monitored side: an extra visit costs an hour, an unmaintained monitored system
 * costs false alarms and police response. The reason tells the office which record to fix.
 */
export function signallingOf(record: SignallingRecord): { signalling: Signalling; reason: string } {
  const paths = record.signallingPaths.length;
  const toCentre = record.signallingPaths.filter((path) => path.toMonitoringCentre).length;
  if (record.monitoringCentreLinked && paths === 0)
    return {
      signalling: 'remotely_monitored',
      reason: 'The site is linked to a monitoring centre (no signalling path recorded yet).',
    };
  if (record.monitoringCentreLinked && toCentre > 0)
    return {
      signalling: 'remotely_monitored',
      reason: `The site is linked to a monitoring centre and ${toCentre === 1 ? 'one signalling path goes' : `${toCentre} signalling paths go`} to it.`,
    };
  if (record.monitoringCentreLinked)
    return {
      signalling: 'remotely_monitored',
      reason:
        'The site is linked to a monitoring centre, but no recorded signalling path goes to it: check the signalling record.',
    };
  if (toCentre > 0)
    return {
      signalling: 'remotely_monitored',
      reason:
        'A signalling path goes to a monitoring centre, but the site names none: check the site record.',
    };
  return {
    signalling: 'audible_only',
    reason:
      paths === 0
        ? 'No monitoring centre and no signalling path: the system is audible only.'
        : 'No signalling path goes to a monitoring centre: the system is audible only.',
  };
}

export function visitsPerYearFor(signalling: Signalling): VisitsPerYear {
  return signalling === 'remotely_monitored' ? 2 : 1;
}

/** Months between preventive visits: 6 for two a year, 12 for one. */
export function intervalMonthsFor(visitsPerYear: number): number {
  if (visitsPerYear !== 1 && visitsPerYear !== 2)
    throw new RangeError(`A plan has 1 or 2 visits a year, not ${visitsPerYear}.`);
  return 12 / visitsPerYear;
}

// --- Calendar arithmetic (Gregorian calendar, as ISO 8601 uses) -------------------------------

const CALENDAR_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

export function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

export function daysInMonth(year: number, month: number): number {
  if (month === 2) return isLeapYear(year) ? 29 : 28;
  return [4, 6, 9, 11].includes(month) ? 30 : 31;
}

function parseCalendarDate(date: string): { year: number; month: number; day: number } {
  const match = CALENDAR_DATE.exec(date);
  if (match) {
    const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
    if (month >= 1 && month <= 12 && day >= 1 && day <= daysInMonth(year, month))
      return { year, month, day };
  }
  throw new RangeError(`Not a calendar date (YYYY-MM-DD): ${date}`);
}

const pad = (value: number, width: number) => String(value).padStart(width, '0');
const formatCalendarDate = (year: number, month: number, day: number) =>
  `${pad(year, 4)}-${pad(month, 2)}-${pad(day, 2)}`;

/**
 * The same day of the month, `months` later; where that month is shorter, its last day
 * (31 August + 6 months = 28 February, or 29th in a leap year). Never spills into the month
 * after, as Date.setMonth does (31 August + 6 months would become 3 March).
 */
export function addCalendarMonths(date: string, months: number): string {
  if (!Number.isInteger(months)) throw new RangeError('Whole months only.');
  const { year, month, day } = parseCalendarDate(date);
  const monthIndex = year * 12 + (month - 1) + months;
  const targetYear = Math.floor(monthIndex / 12);
  const targetMonth = (monthIndex % 12) + 1;
  return formatCalendarDate(
    targetYear,
    targetMonth,
    Math.min(day, daysInMonth(targetYear, targetMonth)),
  );
}

/** Whole days from `from` to `to` (negative when `to` is earlier). */
export function daysBetween(from: string, to: string): number {
  const start = parseCalendarDate(from);
  const end = parseCalendarDate(to);
  return Math.round(
    (Date.UTC(end.year, end.month - 1, end.day) -
      Date.UTC(start.year, start.month - 1, start.day)) /
      86_400_000,
  );
}

// --- The plan ---------------------------------------------------------------------------------

/** A dated event the next visit may be counted from, with the plan it was made under. */
export interface PlanMilestone {
  on: string;
  /** Preventive visits a year under the plan in force then; null when not recorded. */
  visitsPerYear: number | null;
}

export interface ServicePlanFacts {
  signalling: SignallingRecord;
  /** Handover (or, with no pack issued, commissioning): the system went into service. */
  inService: PlanMilestone | null;
  /** The last preventive visit done. */
  lastPreventiveVisit: PlanMilestone | null;
  today: string;
}

export type CountsFrom = 'last_preventive_visit' | 'in_service';

export interface ServicePlan {
  signalling: Signalling;
  signallingReason: string;
  visitsPerYear: VisitsPerYear;
  intervalMonths: number;
  rule: string;
  source: string;
  /** What the next due date is counted from; null when there is nothing to count from yet. */
  countsFrom: CountsFrom | null;
  countsFromOn: string | null;
  nextDueOn: string | null;
  /** Due and not done by the end of the due day. */
  overdue: boolean;
  daysOverdue: number;
  /** The plan differs from the one in force at the milestone the due date counts from. */
  planChange: { fromVisitsPerYear: number; toVisitsPerYear: VisitsPerYear } | null;
}

/**
 * The next preventive visit falls due one interval after the later of the last preventive
 * visit and the day the system went into service: counted from the day the visit was done, not
 * the day it was due, so a late visit moves the cycle on (common practice, no source).
 *
 * When the plan changes (monitoring added or taken away), the next visit is counted from the
 * same milestone with the new plan's interval. It is deliberately not held back to today or to
 * the day of the change:
 *  - held back to today, the due date would move forward every day and the site could never
 *    become overdue;
 *  - Wardbook records when the site and system were saved, not which save changed the plan, so
 *    a "day of the change" would be a guess;
 *  - under the new plan the system really has gone longer than its interval without a visit
 *    (a newly monitored system last seen eight months ago needs a visit now), and the office
 *    should book one.
 * The change is reported (planChange) so the screens can say why the due date moved.
 */
export function servicePlan(facts: ServicePlanFacts): ServicePlan {
  parseCalendarDate(facts.today);
  const { signalling, reason } = signallingOf(facts.signalling);
  const visitsPerYear = visitsPerYearFor(signalling);
  const intervalMonths = intervalMonthsFor(visitsPerYear);
  const milestone = latestMilestone(facts);
  const nextDueOn = milestone ? addCalendarMonths(milestone.on, intervalMonths) : null;
  const daysLate = nextDueOn ? daysBetween(nextDueOn, facts.today) : 0;
  const planAtMilestone = milestone?.milestone.visitsPerYear ?? null;
  return {
    signalling,
    signallingReason: reason,
    visitsPerYear,
    intervalMonths,
    rule: SERVICE_PLAN_RULE,
    source: SERVICE_PLAN_SOURCE,
    countsFrom: milestone?.kind ?? null,
    countsFromOn: milestone?.on ?? null,
    nextDueOn,
    overdue: daysLate > 0,
    daysOverdue: Math.max(0, daysLate),
    planChange:
      planAtMilestone !== null && planAtMilestone !== visitsPerYear
        ? { fromVisitsPerYear: planAtMilestone, toVisitsPerYear: visitsPerYear }
        : null,
  };
}

function latestMilestone(
  facts: ServicePlanFacts,
): { kind: CountsFrom; on: string; milestone: PlanMilestone } | null {
  const { inService, lastPreventiveVisit: visit } = facts;
  if (inService) parseCalendarDate(inService.on);
  if (visit) parseCalendarDate(visit.on);
  // A visit before handover (the old system, or a record put in out of order) does not
  // count: the plan runs from when this system went into service.
  if (visit && (!inService || visit.on >= inService.on))
    return { kind: 'last_preventive_visit', on: visit.on, milestone: visit };
  if (inService) return { kind: 'in_service', on: inService.on, milestone: inService };
  return null;
}
