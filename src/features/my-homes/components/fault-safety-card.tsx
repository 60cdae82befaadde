import { SafetyCard, type SafetyPoint } from '@/components/ui/safety-card';

const points: SafetyPoint[] = [
  {
    id: 'panel',
    lead: 'Do not open the control panel or any detector.',
    text: 'There is mains power and a standby battery inside: leave it for your alarm engineer.',
  },
  {
    id: 'climbing',
    lead: 'Do not climb to reach a sounder or detector.',
    text: 'Take photos from the ground; the engineer brings the right access equipment.',
  },
  {
    id: 'forced-entry',
    lead: 'If there are signs of forced entry, do not go in.',
    text: 'Stay outside at a safe distance and call the police on 999.',
  },
];

/** For a homeowner looking at a faulty part of their system before reporting it. */
export function FaultSafetyCard() {
  return (
    <SafetyCard
      title="Before you look at the fault"
      points={points}
      footnote="General guidance only: local law and your alarm company's advice come first, and your safety comes before the property."
    />
  );
}
