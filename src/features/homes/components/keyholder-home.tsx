import type { ReactNode } from 'react';

import { AlarmAttendanceSafetyCard } from '@/components/ui/alarm-attendance-safety-card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';

type KeyholderHomeProps = {
  /** Alarms going on now, shown first; supplied by the route. */
  alerts?: ReactNode;
  /** The sites this person holds keys for; supplied by the route. */
  children: ReactNode;
  /** Earlier alarms, after everything else; supplied by the route. */
  pastAlerts?: ReactNode;
};

export function KeyholderHome({ alerts, children, pastAlerts }: KeyholderHomeProps) {
  const { data: home } = useRoleHome('keyholder');

  return (
    <>
      <PageHeading title="Keyholder home">
        <p>Welcome, {home.displayName}.</p>
      </PageHeading>
      <div className="grid gap-6">
        {alerts}
        <AlarmAttendanceSafetyCard prominent />
        {children}
        {pastAlerts}
      </div>
    </>
  );
}
