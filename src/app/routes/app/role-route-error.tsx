import { useRouteError } from 'react-router-dom';

import { describeError } from '@/components/errors/describe-error';
import { RouteErrorMessage } from '@/components/errors/route-error-message';

/** Error element for a role's pages; it renders inside the role's frame, so the header stays. */
export function RoleRouteErrorRoute() {
  const error = useRouteError();
  return (
    <>
      <title>{`${describeError(error).heading} · Wardbook`}</title>
      <RouteErrorMessage error={error} />
    </>
  );
}
