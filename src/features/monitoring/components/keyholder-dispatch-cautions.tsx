import { SafetyCard, type SafetyPoint } from '@/components/ui/safety-card';

const points: SafetyPoint[] = [
  {
    id: 'forced-entry',
    lead: 'Do not go in where there are signs of forced entry.',
    text: 'A broken window, a forced door or someone inside: wait for the police at a safe distance.',
  },
  {
    id: 'lone-working',
    lead: 'Do not attend alone.',
    text: 'Go in pairs, or stay on the phone with the centre until you are safely away again.',
  },
  {
    id: 'police',
    lead: 'Call the police from a safe place',
    text: 'if a crime looks to be in progress; in the UK, 999.',
  },
  {
    id: 'phone',
    lead: 'Keep your phone on',
    text: 'so the centre can reach you on the way and while you are there.',
  },
];

/** What the operator tells every keyholder they send to a site. */
export function KeyholderDispatchCautions() {
  return (
    <SafetyCard
      title="Tell every keyholder you send"
      points={points}
      footnote="Reminders only: your centre's procedures, its lone-working policy and local law come first."
    />
  );
}
