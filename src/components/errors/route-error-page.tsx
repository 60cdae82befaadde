import { useRouteError } from 'react-router-dom';

import { describeError } from '@/components/errors/describe-error';
import { RouteErrorMessage } from '@/components/errors/route-error-message';
import { PublicLayout } from '@/components/layouts/public-layout';

/** Error element for routes that have no role frame around them. */
export function RouteErrorPage() {
  const error = useRouteError();
  return (
    <PublicLayout>
      <title>{`${describeError(error).heading} · Wardbook`}</title>
      <div className="mx-auto max-w-6xl px-4 py-12 md:px-6">
        <RouteErrorMessage error={error} />
      </div>
    </PublicLayout>
  );
}
