import { WARNING_AFTER, WITHDRAWAL_AFTER } from '@server/calc/police-response';

import { Notice, type NoticeTone } from '@/components/ui/notice';
import { formatCalendarDate } from '@/lib/dates';

export type FalseAlarmSummary = {
  count: number;
  standing: 'in_good_standing' | 'warning' | 'withdrawal_due';
  oldestDropsOffAt: string | null;
};

type FalseAlarmStandingProps = {
  falseAlarms: FalseAlarmSummary;
  /** Homeowners read "your system"; staff read "this site". */
  audience?: 'staff' | 'homeowner';
  className?: string;
};

const plural = (count: number) => `${count} false ${count === 1 ? 'alarm' : 'alarms'}`;

/**
 * False alarms in the rolling twelve months and what they mean for police response. Under NPCC
 * policy an intruder alarm brings a police warning after two false calls in a rolling twelve
 * months and loses police response after three (../shared/checks.md).
 */
export function FalseAlarmStanding({
  falseAlarms,
  audience = 'staff',
  className,
}: FalseAlarmStandingProps) {
  const { count, standing, oldestDropsOffAt } = falseAlarms;
  const subject = audience === 'homeowner' ? 'your system' : 'this site';
  const states: Record<FalseAlarmSummary['standing'], { tone: NoticeTone; text: string }> = {
    in_good_standing: {
      tone: count === 0 ? 'normal' : 'info',
      text:
        count === 0
          ? `No false alarms from ${subject} in the last 12 months.`
          : `${WARNING_AFTER - count === 1 ? 'One more' : `${WARNING_AFTER - count} more`} in the 12 months would bring a police warning (NPCC policy).`,
    },
    warning: {
      tone: 'fault',
      text: `At ${WARNING_AFTER} false alarms in 12 months the police issue a warning. ${
        WITHDRAWAL_AFTER - count <= 1 ? 'One more' : `${WITHDRAWAL_AFTER - count} more`
      } and police response is withdrawn (NPCC policy).`,
    },
    withdrawal_due: {
      tone: 'alarm',
      text: `At ${WITHDRAWAL_AFTER} or more false alarms in 12 months police response is withdrawn (NPCC policy). Restoring it needs the cause put right and a period free of false alarms.`,
    },
  };
  const state = states[standing];
  return (
    <Notice
      tone={state.tone}
      title={`${plural(count)} in the last 12 months`}
      className={className}
    >
      <p>{state.text}</p>
      {oldestDropsOffAt && count > 0 ? (
        <p className="mt-1">
          The oldest drops out of the count on{' '}
          <time dateTime={oldestDropsOffAt}>{formatCalendarDate(oldestDropsOffAt)}</time>.
        </p>
      ) : null}
    </Notice>
  );
}
