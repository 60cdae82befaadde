import type { ReactNode } from 'react';

import { AlarmAttendanceSafetyCard } from '@/components/ui/alarm-attendance-safety-card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';

type HomeownerHomeProps = {
  /** The homeowner's homes, each with who to call; supplied by the route. */
  children: ReactNode;
};

export function HomeownerHome({ children }: HomeownerHomeProps) {
  const { data: home } = useRoleHome('homeowner');

  return (
    <>
      <PageHeading title="My home">
        <p>Welcome, {home.displayName}.</p>
      </PageHeading>
      <div className="grid gap-8">
        {children}
        <AlarmAttendanceSafetyCard />
      </div>
    </>
  );
}
