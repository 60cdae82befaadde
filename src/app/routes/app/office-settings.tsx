import type { QueryClient } from '@tanstack/react-query';

import { PageHeading } from '@/components/ui/page-heading';
import { getPackSettingsQueryOptions } from '@/features/handover/api/pack-settings';
import { PackSettingsPanel } from '@/features/handover/components/pack-settings-panel';

export function createLoader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(getPackSettingsQueryOptions());
    return null;
  };
}

/** The company's settings that office staff keep. */
export function Component() {
  return (
    <>
      <title>Settings · Wardbook</title>
      <PageHeading title="Settings">
        <p>How your company’s handover packs are numbered and sealed.</p>
      </PageHeading>
      <section aria-labelledby="pack-settings-heading" className="grid gap-4">
        <h2 id="pack-settings-heading" className="text-xl font-semibold">
          Pack numbering and seal
        </h2>
        <PackSettingsPanel />
      </section>
    </>
  );
}
