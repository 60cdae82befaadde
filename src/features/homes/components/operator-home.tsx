import type { ReactNode } from 'react';
import { Headset } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';
import { KeyholderCallReminderCard } from '@/features/homes/components/keyholder-call-reminder-card';
import { PeopleTable } from '@/features/homes/components/people-table';

type OperatorHomeProps = {
  /** The live signal queue; supplied by the route. */
  children: ReactNode;
};

export function OperatorHome({ children }: OperatorHomeProps) {
  const { data: home } = useRoleHome('operator');

  return (
    <>
      <PageHeading title="Operator home">
        <p>
          On duty for <span className="font-semibold text-ink">{home.organisation.name}</span>. Take
          the event at the top of the queue first: it is the highest priority and the longest
          waiting.
        </p>
      </PageHeading>
      <div className="grid gap-6">
        {children}
        <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
          <Card title="Operators" icon={Headset} flush>
            <PeopleTable
              caption={`Operators at ${home.organisation.name}`}
              people={home.operators}
              emptyMessage="No other operators are in Wardbook yet."
              dense
            />
          </Card>
          <aside aria-label="Safety" className="min-w-0">
            <KeyholderCallReminderCard />
          </aside>
        </div>
      </div>
    </>
  );
}
