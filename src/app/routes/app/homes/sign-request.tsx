import type { QueryClient } from '@tanstack/react-query';
import { useParams, type LoaderFunctionArgs, type Params } from 'react-router-dom';

import { PageHeading } from '@/components/ui/page-heading';
import { useMe } from '@/features/auth/api/get-me';
import { getSigningRequestQueryOptions } from '@/features/handover/api/signing-request';
import { SignRequestPanel } from '@/features/handover/components/sign-request-panel';

function requestIdFrom(params: Params): string {
  const requestId = params.requestId;
  if (!requestId) {
    throw new Response('No signing request in the address', {
      status: 404,
      statusText: 'Not Found',
    });
  }
  return requestId;
}

// Reached from the link in the signing-request e-mail. Signed out, the sign-in brings the
// homeowner straight back here (the layout's loader sends this address as the return path).
export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    await queryClient.ensureQueryData(getSigningRequestQueryOptions(requestIdFrom(params)));
    return null;
  };
}

export function Component() {
  const requestId = requestIdFrom(useParams());
  const { data: me } = useMe();
  return (
    <>
      <title>Sign the handover · Wardbook</title>
      <PageHeading title="Sign the handover">
        <p>
          Your alarm company asks you to countersign the handover of your alarm system. Read the
          variations and the pack, then sign below.
        </p>
      </PageHeading>
      <SignRequestPanel requestId={requestId} signerName={me?.user.displayName ?? ''} />
    </>
  );
}
