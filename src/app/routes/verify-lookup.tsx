import { PublicLayout } from '@/components/layouts/public-layout';
import { VerifyLookupForm } from '@/features/handover/components/verify-lookup-form';
import { PublishedSealKeys } from '@/features/handover/components/published-seal-keys';

/** Public: find a handover pack by its number to check its status and seal. */
export function VerifyLookupRoute() {
  return (
    <PublicLayout>
      <title>Check a handover pack · Wardbook</title>
      <div className="mx-auto grid max-w-3xl gap-10 px-4 py-10 md:px-6">
        <div className="grid gap-6">
          <div>
            <h1 tabIndex={-1} className="text-2xl font-semibold tracking-tight md:text-3xl">
              Check a handover pack
            </h1>
            <p className="mt-2 max-w-prose text-ink-muted">
              Every handover pack made in Wardbook is numbered and sealed when it is issued. Enter
              its number to see whether it is still valid, who issued it, and to check that a copy
              is exactly the one issued. No account is needed.
            </p>
          </div>
          <VerifyLookupForm />
        </div>
        <PublishedSealKeys />
      </div>
    </PublicLayout>
  );
}
