import { SafetyCard, type SafetyPoint } from '@/components/ui/safety-card';

const points: SafetyPoint[] = [
  {
    id: 'forced-entry',
    lead: 'Never go in if there are signs of forced entry.',
    text: 'A broken window, a forced door or lock, or someone inside: stay outside and keep your distance.',
  },
  {
    id: 'pairs',
    lead: 'Attend in pairs.',
    text: 'Take someone with you rather than going alone.',
  },
  {
    id: 'police',
    lead: 'Call the police from a safe place,',
    text: 'away from the property. In an emergency in the UK, dial 999.',
  },
  {
    id: 'monitoring-centre',
    lead: "Follow the monitoring centre's instructions.",
    text: 'If they ask you not to attend, or to wait for the police, do that.',
  },
];

type AlarmAttendanceSafetyCardProps = { prominent?: boolean };

/** For anyone who may go to a property after its alarm has gone off. */
export function AlarmAttendanceSafetyCard({ prominent = false }: AlarmAttendanceSafetyCardProps) {
  return (
    <SafetyCard
      title="If you go to an alarm"
      points={points}
      prominent={prominent}
      footnote="General guidance only: the monitoring centre's instructions and local law come first, and your safety comes before the property."
    />
  );
}
