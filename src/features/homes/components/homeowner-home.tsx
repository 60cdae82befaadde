import { Phone } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { PageHeading } from '@/components/ui/page-heading';
import { useRoleHome } from '@/features/homes/api/get-role-home';
import { AlarmAttendanceSafetyCard } from '@/features/homes/components/alarm-attendance-safety-card';

export function HomeownerHome() {
  const { data: home } = useRoleHome('homeowner');

  return (
    <>
      <PageHeading title="My home">
        <p>Welcome, {home.displayName}.</p>
      </PageHeading>
      <div className="grid gap-5">
        <Card title="Who to call" icon={Phone}>
          <p className="text-base">
            Your alarm company&apos;s and monitoring centre&apos;s contact details will appear here
            once your alarm system has been recorded in Wardbook.
          </p>
        </Card>
        <AlarmAttendanceSafetyCard />
      </div>
    </>
  );
}
