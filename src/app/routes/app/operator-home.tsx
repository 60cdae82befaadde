import { useMe } from '@/features/auth/api/get-me';
import { OperatorHome } from '@/features/homes/components/operator-home';
import { MonitoringQueue } from '@/features/monitoring/components/monitoring-queue';

export function OperatorHomeRoute() {
  const { data: me } = useMe();
  return (
    <>
      <title>Operator home · Wardbook</title>
      <OperatorHome>
        <MonitoringQueue myUserId={me?.user.id ?? ''} />
      </OperatorHome>
    </>
  );
}
