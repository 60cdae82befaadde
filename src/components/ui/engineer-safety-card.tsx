import { SafetyCard, type SafetyPoint } from '@/components/ui/safety-card';

const points: SafetyPoint[] = [
  {
    id: 'ladders',
    lead: 'Ladders:',
    text: (
      <>
        short-duration work only. Set them at a 1-in-4 angle (one out for every four up), keep three
        points of contact, and extend at least 1 m above the landing point (HSE INDG455).
      </>
    ),
  },
  {
    id: 'drilling',
    lead: 'Before drilling,',
    text: 'check for hidden cables and pipes with a detector.',
  },
  {
    id: 'panels',
    lead: 'Before opening a panel,',
    text: 'isolate the mains supply and disconnect the standby battery. Mains work is for a competent person, to BS 7671.',
  },
  {
    id: 'asbestos',
    lead: 'Asbestos',
    text: 'may be present in buildings built or refurbished before 2000. If you suspect it, do not disturb it: stop and ask.',
  },
  {
    id: 'lone-working',
    lead: 'Working alone?',
    text: 'Tell someone where you are and when you expect to finish.',
  },
];

/**
 * Every caution for work on site: ladders, drilling, opening the panel, asbestos and working
 * alone. Shared by the engineer's home and the commissioning screens.
 */
export function EngineerSafetyCard({ className }: { className?: string }) {
  return (
    <SafetyCard
      title="Before you climb, drill or open a panel"
      className={className}
      points={points}
      footnote="These reminders do not replace local codes, your company's risk assessments or licensed practice. Where those say more, follow them."
    />
  );
}
