import { SafetyCard, type SafetyPoint } from '@/components/ui/safety-card';

const points: SafetyPoint[] = [
  {
    id: 'ladders',
    lead: 'Ladders:',
    text: 'short-duration work only. Set them at a 1-in-4 angle (one out for every four up), keep three points of contact, and extend at least 1 m above the landing point (HSE INDG455).',
  },
  {
    id: 'drilling',
    lead: 'Before drilling,',
    text: 'detect hidden cables and pipes with a detector first.',
  },
  {
    id: 'asbestos',
    lead: 'Asbestos',
    text: 'may be present in buildings built or refurbished before 2000. If you suspect it, do not drill or disturb it: stop and ask.',
  },
  {
    id: 'lone-working',
    lead: 'Working alone?',
    text: 'Tell someone where you are and when you expect to finish.',
  },
];

/** For fitting detectors and running cable: climbing and drilling. */
export function InstallationSafetyCard() {
  return (
    <SafetyCard
      title="Before you climb or drill"
      points={points}
      footnote="These reminders do not replace local codes, your company's risk assessments or licensed practice. Where those say more, follow them."
    />
  );
}
