import { SafetyCard, type SafetyPoint } from '@/components/ui/safety-card';

const points: SafetyPoint[] = [
  {
    id: 'isolate',
    lead: 'Isolate the mains and disconnect the standby battery',
    text: 'before you open the panel or a power supply, and prove them dead before touching the terminals.',
  },
  {
    id: 'mains',
    lead: 'Mains work',
    text: 'is for a competent person, to BS 7671.',
  },
  {
    id: 'battery',
    lead: 'Batteries',
    text: 'can deliver a large current into a short circuit: keep tools clear of both terminals at once.',
  },
];

export function PanelSafetyCard() {
  return (
    <SafetyCard
      title="Before opening the panel"
      points={points}
      footnote="These reminders do not replace local codes, your company's risk assessments or licensed practice. Where those say more, follow them."
    />
  );
}
