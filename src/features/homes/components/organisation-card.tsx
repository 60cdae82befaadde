import { Building2, RadioTower } from 'lucide-react';

import { Card } from '@/components/ui/card';
import type { Organisation } from '@/types/api';

const organisationKinds: Record<Organisation['kind'], string> = {
  installer: 'Alarm company (installer)',
  monitoring_centre: 'Monitoring centre',
};

type OrganisationCardProps = {
  title: string;
  organisation: Organisation;
  peopleCount: number;
};

export function OrganisationCard({ title, organisation, peopleCount }: OrganisationCardProps) {
  return (
    <Card title={title} icon={organisation.kind === 'monitoring_centre' ? RadioTower : Building2}>
      <dl className="grid gap-x-8 gap-y-3 sm:grid-cols-3">
        <div>
          <dt className="text-sm text-ink-muted">Name</dt>
          <dd className="font-semibold">{organisation.name}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Kind</dt>
          <dd>{organisationKinds[organisation.kind]}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">People in Wardbook</dt>
          <dd className="font-mono">{peopleCount}</dd>
        </div>
      </dl>
    </Card>
  );
}
