import { Crosshair } from 'lucide-react';

import { Card } from '@/components/ui/card';

const reminders = [
  'Not facing windows, or heat sources such as radiators, heaters and cookers.',
  'Out of direct sunlight, including sun that moves across the room during the day.',
  'Away from draughts: air vents, fans and doors that are often open.',
  'Where insects cannot crawl across the lens, and beyond pets’ reach.',
  'Mounted at the height and angle the maker gives, with a clear view of the area it protects.',
];

/** Common causes of false alarms, to check while the detector is being sited. */
export function SitingReminderCard() {
  return (
    <Card title="Siting detectors" icon={Crosshair}>
      <ul className="grid gap-2 text-sm">
        {reminders.map((reminder) => (
          <li key={reminder} className="flex gap-2">
            <span aria-hidden="true" className="mt-2 size-1.5 shrink-0 rounded-full bg-brass" />
            <span>{reminder}</span>
          </li>
        ))}
      </ul>
      <p className="mt-3 text-sm text-ink-muted">
        Each false alarm counts against the site&rsquo;s police response; a detector sited well is
        the cheapest way to avoid one.
      </p>
    </Card>
  );
}
