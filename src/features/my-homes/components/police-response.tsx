import type { MyHome } from '@server/my/schema';

import { FalseAlarmStanding, type FalseAlarmSummary } from '@/components/ui/false-alarm-standing';
import { Notice, type NoticeTone } from '@/components/ui/notice';

type PoliceResponseProps = {
  home: Pick<MyHome, 'urnStatus' | 'policeUrn' | 'monitoringCentre'>;
  /** The false alarms counted against police response, where the page has them. */
  falseAlarms?: FalseAlarmSummary;
};

/**
 * Police response in plain words. Under NPCC policy a monitored system with a police reference
 * (URN) can have confirmed alarms passed to the police; false alarms put that at risk.
 */
export function PoliceResponse({ home, falseAlarms }: PoliceResponseProps) {
  const urn = home.policeUrn ? ` (URN ${home.policeUrn})` : '';
  const states: Record<MyHome['urnStatus'], { tone: NoticeTone; title: string; text: string }> = {
    none: {
      tone: 'info',
      title: 'No police response',
      text: home.monitoringCentre
        ? 'The monitoring centre calls your keyholders, not the police.'
        : 'Police response needs a monitored system with a police reference number (URN).',
    },
    applied: {
      tone: 'info',
      title: 'Police response applied for',
      text: 'The police have not yet issued the reference number (URN). Until they do, the monitoring centre calls your keyholders only.',
    },
    active: {
      tone: 'normal',
      title: 'Police response active',
      text: `Confirmed alarms can be passed to the police${urn}.`,
    },
    warning: {
      tone: 'fault',
      title: 'Police response at risk',
      text: `False alarms in the last 12 months have brought a warning from the police${urn}. One more may mean the police stop responding. Ask your alarm company to find the cause.`,
    },
    withdrawn: {
      tone: 'alarm',
      title: 'Police response withdrawn',
      text: 'After repeated false alarms the police no longer respond to this system. Your alarm company can tell you how to have it restored.',
    },
  };
  const state = states[home.urnStatus];
  const notice = (
    <Notice tone={state.tone} title={state.title}>
      {state.text}
    </Notice>
  );
  if (!falseAlarms) return notice;
  return (
    <div className="grid gap-3">
      {notice}
      <FalseAlarmStanding falseAlarms={falseAlarms} audience="homeowner" />
    </div>
  );
}
