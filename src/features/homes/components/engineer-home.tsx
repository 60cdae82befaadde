import { Users } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { EngineerSafetyCard } from '@/components/ui/engineer-safety-card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';
import { OrganisationCard } from '@/features/homes/components/organisation-card';
import { PeopleTable } from '@/features/homes/components/people-table';

export function EngineerHome() {
  const { data: home } = useRoleHome('engineer');

  return (
    <>
      <PageHeading title="Engineer home">
        <p>
          Working for <span className="font-semibold text-ink">{home.organisation.name}</span>.
          Sites, systems and service visits will appear here as your company records them.
        </p>
      </PageHeading>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="grid min-w-0 content-start gap-6">
          <OrganisationCard
            title="Your company"
            organisation={home.organisation}
            peopleCount={home.colleagues.length}
          />
          <Card title="Colleagues" icon={Users} flush>
            <PeopleTable
              caption={`People at ${home.organisation.name}`}
              people={home.colleagues}
              emptyMessage="No colleagues are in Wardbook yet."
            />
          </Card>
        </div>
        <aside aria-label="Safety" className="min-w-0">
          <EngineerSafetyCard />
        </aside>
      </div>
    </>
  );
}
