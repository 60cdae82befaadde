import { KeyRound } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';
import { AlarmAttendanceSafetyCard } from '@/features/homes/components/alarm-attendance-safety-card';

export function KeyholderHome() {
  const { data: home } = useRoleHome('keyholder');

  return (
    <>
      <PageHeading title="Keyholder home">
        <p>Welcome, {home.displayName}.</p>
      </PageHeading>
      <div className="grid gap-5">
        <AlarmAttendanceSafetyCard prominent />
        <Card title="Homes you hold keys for" icon={KeyRound}>
          <p className="text-base">
            When a homeowner names you as a keyholder, their access notes and call plan will appear
            here, and you will be able to answer alerts with whether you can attend.
          </p>
        </Card>
      </div>
    </>
  );
}
