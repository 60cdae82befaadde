import { addCalendarMonths } from './service-plan';

/**
 * What it takes to have police response reinstated once false alarms have withdrawn it. Under
 * the NPCC policy on police response to security systems (../shared/checks.md), response comes
 * back after remedial work, or after three months free of false alarms. Pure: the caller
 * supplies the dates (UK calendar dates, "YYYY-MM-DD") and today.
 */
export const REINSTATEMENT_RULE =
  'Police response comes back after remedial work, or after 3 months free of false alarms';
export const REINSTATEMENT_SOURCE =
  'NPCC policy on police response to security systems (as summarised in ../shared/checks.md)';
export const CLEAR_MONTHS = 3;

export interface RemedialVisit {
  id: string;
  doneOn: string;
  cause: string;
  actionTaken: string;
}

export interface ReinstatementFacts {
  /** Days on which the site raised a false alarm, in any order. */
  falseAlarmDates: readonly string[];
  /** Call-outs done that found a false alarm's cause and dealt with it. */
  remedialVisits: readonly RemedialVisit[];
  today: string;
}

export interface ReinstatementItem {
  item: 'remedial_work' | 'three_months_clear';
  met: boolean;
  words: string;
}

export interface Reinstatement {
  rule: string;
  source: string;
  lastFalseAlarmOn: string | null;
  /** The day three clear months are up: the last false alarm plus three calendar months. */
  clearOn: string | null;
  /** The call-out that counts as the remedial work, when there is one. */
  remedialVisitId: string | null;
  items: [ReinstatementItem, ReinstatementItem];
  /** Either way is enough. */
  met: boolean;
}

const latest = (dates: readonly string[]) =>
  dates.reduce<string | null>((best, date) => (best === null || date > best ? date : best), null);

export function reinstatement(facts: ReinstatementFacts): Reinstatement {
  const lastFalseAlarmOn = latest(facts.falseAlarmDates);
  const clearOn = lastFalseAlarmOn ? addCalendarMonths(lastFalseAlarmOn, CLEAR_MONTHS) : null;

  // Work done before the latest false alarm evidently did not cure it, so only a call-out on
  // or after that day counts (common practice, no source).
  const remedial = facts.remedialVisits
    .filter((visit) => lastFalseAlarmOn === null || visit.doneOn >= lastFalseAlarmOn)
    .sort((a, b) => (a.doneOn < b.doneOn ? 1 : a.doneOn > b.doneOn ? -1 : 0))[0];

  const remedialItem: ReinstatementItem = remedial
    ? {
        item: 'remedial_work',
        met: true,
        words: `Remedial work done on ${remedial.doneOn}: ${remedial.actionTaken} (cause found: ${remedial.cause}).`,
      }
    : {
        item: 'remedial_work',
        met: false,
        words: lastFalseAlarmOn
          ? `No call-out since the last false alarm (${lastFalseAlarmOn}) has recorded the cause and the work done.`
          : 'No call-out has recorded a false alarm cause and the work done.',
      };

  const clear = clearOn === null || facts.today >= clearOn;
  const clearItem: ReinstatementItem = {
    item: 'three_months_clear',
    met: clear,
    words:
      clearOn === null
        ? 'No false alarm is recorded.'
        : clear
          ? `Free of false alarms since ${lastFalseAlarmOn}: three months were up on ${clearOn}.`
          : `The last false alarm was on ${lastFalseAlarmOn}: three months free of them are up on ${clearOn}.`,
  };

  return {
    rule: REINSTATEMENT_RULE,
    source: REINSTATEMENT_SOURCE,
    lastFalseAlarmOn,
    clearOn,
    remedialVisitId: remedial?.id ?? null,
    items: [remedialItem, clearItem],
    met: remedialItem.met || clearItem.met,
  };
}
