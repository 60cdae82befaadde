import { Suspense } from 'react';

import { LoadingStatus } from '@/components/ui/loading-status';
import { KeyholderHome } from '@/features/homes/components/keyholder-home';
import { MyKeyholdingsList } from '@/features/keyholdings/components/my-keyholdings-list';

export function KeyholderHomeRoute() {
  return (
    <>
      <title>Keyholder home · Wardbook</title>
      <KeyholderHome>
        <Suspense fallback={<LoadingStatus label="Loading the homes you hold keys for" />}>
          <MyKeyholdingsList />
        </Suspense>
      </KeyholderHome>
    </>
  );
}
