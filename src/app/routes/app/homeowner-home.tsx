import { Suspense } from 'react';

import { LoadingStatus } from '@/components/ui/loading-status';
import { HomeownerHome } from '@/features/homes/components/homeowner-home';
import { MyHomesList } from '@/features/my-homes/components/my-homes-list';

export function HomeownerHomeRoute() {
  return (
    <>
      <title>My home · Wardbook</title>
      <HomeownerHome>
        {/* The page heading shows at once; the homes follow when they arrive. */}
        <Suspense fallback={<LoadingStatus label="Loading your homes" />}>
          <MyHomesList />
        </Suspense>
      </HomeownerHome>
    </>
  );
}
