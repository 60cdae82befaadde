import { Suspense } from 'react';

import { LoadingStatus } from '@/components/ui/loading-status';
import { ActiveAlerts, PastAlerts } from '@/features/alerts/components/my-alerts';
import { KeyholderHome } from '@/features/homes/components/keyholder-home';
import { MyKeyholdingsList } from '@/features/keyholdings/components/my-keyholdings-list';

export function KeyholderHomeRoute() {
  return (
    <>
      <title>Keyholder home · Wardbook</title>
      <KeyholderHome alerts={<ActiveAlerts />} pastAlerts={<PastAlerts />}>
        <Suspense fallback={<LoadingStatus label="Loading the homes you hold keys for" />}>
          <MyKeyholdingsList />
        </Suspense>
      </KeyholderHome>
    </>
  );
}
