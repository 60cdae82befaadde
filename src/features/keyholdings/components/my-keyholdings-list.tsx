import { KeyRound } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { useMyKeyholdings } from '@/features/keyholdings/api/get-my-keyholdings';
import { KeyholdingCard } from '@/features/keyholdings/components/keyholding-card';

/** The sites this person holds keys for. */
export function MyKeyholdingsList() {
  const { data: keyholdings } = useMyKeyholdings();

  if (keyholdings.length === 0) {
    return (
      <Card title="Homes you hold keys for" icon={KeyRound}>
        <p className="text-base">
          Nobody has named you as a keyholder yet. When a homeowner does, the address, access notes
          and your place in their call plan appear here.
        </p>
      </Card>
    );
  }

  return (
    <ul aria-label="Homes you hold keys for" className="grid gap-6">
      {keyholdings.map((keyholding) => (
        <li key={keyholding.keyholderId}>
          <KeyholdingCard keyholding={keyholding} />
        </li>
      ))}
    </ul>
  );
}
