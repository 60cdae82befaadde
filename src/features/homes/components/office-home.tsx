import { History, Users } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';
import { AuditTable } from '@/features/homes/components/audit-table';
import { OrganisationCard } from '@/features/homes/components/organisation-card';
import { PeopleTable } from '@/features/homes/components/people-table';

export function OfficeHome() {
  const { data: home } = useRoleHome('office');

  return (
    <>
      <PageHeading title="Office home">
        <p>
          The people and recent changes at{' '}
          <span className="font-semibold text-ink">{home.organisation.name}</span>.
        </p>
      </PageHeading>
      <div className="grid gap-6">
        <OrganisationCard
          title="Your company"
          organisation={home.organisation}
          peopleCount={home.members.length}
        />
        <Card title="Members" icon={Users} flush>
          <PeopleTable
            caption={`Members of ${home.organisation.name}`}
            people={home.members}
            emptyMessage="Nobody else is in Wardbook yet."
            dense
          />
        </Card>
        <Card title="Recent audit entries" icon={History} flush>
          <AuditTable entries={home.recentAudit} />
        </Card>
      </div>
    </>
  );
}
