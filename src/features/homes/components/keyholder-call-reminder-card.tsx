import { SafetyCard, type SafetyPoint } from '@/components/ui/safety-card';

const points: SafetyPoint[] = [
  {
    id: 'forced-entry',
    lead: 'No entry where there are signs of forced entry:',
    text: 'the keyholder waits outside, at a distance.',
  },
  { id: 'pairs', lead: 'Attend in pairs,', text: 'never alone.' },
  {
    id: 'police',
    lead: 'Police from a safe place:',
    text: 'the keyholder calls away from the property.',
  },
];

/** What an operator reminds each keyholder of when asking them to attend. */
export function KeyholderCallReminderCard() {
  return (
    <SafetyCard
      title="When you call a keyholder, remind them"
      points={points}
      footnote="Follow your centre's procedures and local law on keyholder response."
    />
  );
}
