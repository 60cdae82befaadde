import type { ReactNode } from 'react';

import { AlarmAttendanceSafetyCard } from '@/components/ui/alarm-attendance-safety-card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';

type KeyholderHomeProps = {
  /** The sites this person holds keys for; supplied by the route. */
  children: ReactNode;
};

export function KeyholderHome({ children }: KeyholderHomeProps) {
  const { data: home } = useRoleHome('keyholder');

  return (
    <>
      <PageHeading title="Keyholder home">
        <p>Welcome, {home.displayName}.</p>
      </PageHeading>
      <div className="grid gap-6">
        <AlarmAttendanceSafetyCard prominent />
        {children}
      </div>
    </>
  );
}
