import type { QueryClient } from '@tanstack/react-query';
import {
  data,
  isRouteErrorResponse,
  Link,
  redirect,
  useParams,
  useRouteError,
  type LoaderFunctionArgs,
} from 'react-router-dom';
import { SearchX } from 'lucide-react';

import { RouteErrorMessage } from '@/components/errors/route-error-message';
import { PublicLayout } from '@/components/layouts/public-layout';
import { paths } from '@/config/paths';
import {
  getVerificationQueryOptions,
  useVerification,
} from '@/features/handover/api/get-verification';
import { PdfCheckForm } from '@/features/handover/components/pdf-check-form';
import {
  VerificationFacts,
  VerificationSeal,
  VerificationStatus,
} from '@/features/handover/components/verification-details';
import { VerifyLookupForm } from '@/features/handover/components/verify-lookup-form';
import { normalisePackNumber } from '@/features/handover/utils/pack-numbers';
import { ApiError } from '@/lib/api-client';

type NoPackData = { packNumber: string };

const noSuchPack = (packNumber: string) =>
  data<NoPackData>({ packNumber }, { status: 404, statusText: 'Not Found' });

/** Public. A mistyped number, or one never issued, is "no pack with that number", not an error. */
export function createLoader(queryClient: QueryClient) {
  return async ({ params }: LoaderFunctionArgs) => {
    const typed = params.packNumber ?? '';
    const packNumber = normalisePackNumber(typed);
    if (!packNumber) throw noSuchPack(typed);
    // One address per pack, however it was typed into the bar.
    if (packNumber !== typed) throw redirect(paths.verify.pack.getHref(packNumber));
    try {
      await queryClient.ensureQueryData(getVerificationQueryOptions(packNumber));
    } catch (error) {
      if (error instanceof ApiError && error.status === 404) throw noSuchPack(packNumber);
      throw error;
    }
    return null;
  };
}

export function VerifyPackRoute() {
  const packNumber = useParams().packNumber ?? '';
  const { data: verification } = useVerification(packNumber);

  return (
    <PublicLayout>
      <title>{`Pack ${verification.packNumber} · Check a handover pack · Wardbook`}</title>
      <div className="mx-auto grid max-w-3xl gap-8 px-4 py-10 md:px-6">
        <div className="grid gap-4">
          <div>
            <p className="font-semibold text-ink-muted">Handover pack</p>
            <h1
              tabIndex={-1}
              className="font-mono text-2xl font-semibold tracking-tight break-all md:text-3xl"
            >
              {verification.packNumber}
            </h1>
          </div>
          <VerificationStatus verification={verification} />
        </div>
        <VerificationFacts verification={verification} />
        <VerificationSeal verification={verification} />
        <PdfCheckForm packNumber={verification.packNumber} />
        <p>
          <Link
            to={paths.verify.lookup.getHref()}
            className="inline-flex min-h-11 items-center font-semibold"
          >
            Check another pack
          </Link>
        </p>
      </div>
    </PublicLayout>
  );
}

function isNoPack(error: unknown): error is { data: NoPackData } {
  return isRouteErrorResponse(error) && error.status === 404;
}

/** "No pack with that number", with the search again; anything else as the usual error page. */
export function VerifyPackError() {
  const error = useRouteError();
  if (!isNoPack(error)) {
    return (
      <PublicLayout>
        <title>Check a handover pack · Wardbook</title>
        <div className="mx-auto max-w-3xl px-4 py-12 md:px-6">
          <RouteErrorMessage error={error} />
        </div>
      </PublicLayout>
    );
  }
  const typed = typeof error.data?.packNumber === 'string' ? error.data.packNumber : '';
  return (
    <PublicLayout>
      <title>No pack with that number · Wardbook</title>
      <div className="mx-auto grid max-w-3xl gap-6 px-4 py-12 md:px-6">
        <div>
          <h1
            tabIndex={-1}
            className="flex items-center gap-3 text-2xl font-semibold tracking-tight md:text-3xl"
          >
            <SearchX aria-hidden="true" className="size-8 shrink-0 text-ink" />
            No pack with that number
          </h1>
          <p className="mt-3 max-w-prose text-ink-muted">
            {typed ? (
              <>
                Wardbook has no handover pack numbered{' '}
                <span className="font-mono break-all text-ink">{typed}</span>.{' '}
              </>
            ) : null}
            Check the number on the pack’s cover or the foot of any page and try again. If it is
            right, the pack may not have been issued through Wardbook: ask the alarm company.
          </p>
        </div>
        <VerifyLookupForm defaultValue={typed} />
      </div>
    </PublicLayout>
  );
}
