import { Headset } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';
import { KeyholderCallReminderCard } from '@/features/homes/components/keyholder-call-reminder-card';
import { OrganisationCard } from '@/features/homes/components/organisation-card';
import { PeopleTable } from '@/features/homes/components/people-table';

export function OperatorHome() {
  const { data: home } = useRoleHome('operator');

  return (
    <>
      <PageHeading title="Operator home">
        <p>
          On duty for <span className="font-semibold text-ink">{home.organisation.name}</span>. The
          live signal queue will appear here once systems are linked to your centre.
        </p>
      </PageHeading>
      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="grid min-w-0 content-start gap-6">
          <OrganisationCard
            title="Your monitoring centre"
            organisation={home.organisation}
            peopleCount={home.operators.length}
          />
          <Card title="Operators" icon={Headset} flush>
            <PeopleTable
              caption={`Operators at ${home.organisation.name}`}
              people={home.operators}
              emptyMessage="No other operators are in Wardbook yet."
              dense
            />
          </Card>
        </div>
        <aside aria-label="Safety" className="min-w-0">
          <KeyholderCallReminderCard />
        </aside>
      </div>
    </>
  );
}
