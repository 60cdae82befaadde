import { House } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { useMyHomes } from '@/features/my-homes/api/get-my-homes';
import { MyHomeSummaryCard } from '@/features/my-homes/components/my-home-summary-card';

/** Every home the homeowner is linked to, each with its "who to call" card. */
export function MyHomesList() {
  const { data: homes } = useMyHomes();

  if (homes.length === 0) {
    return (
      <Card title="Your alarm system" icon={House}>
        <p className="text-base">
          Your alarm company has not linked a home to your account yet. Once they have, its system,
          keyholders and documents appear here.
        </p>
      </Card>
    );
  }

  return (
    <ul aria-label="Your homes" className="grid gap-8">
      {homes.map((home) => (
        <li key={home.id}>
          <MyHomeSummaryCard home={home} />
        </li>
      ))}
    </ul>
  );
}
