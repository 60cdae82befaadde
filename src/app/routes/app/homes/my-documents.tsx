import type { QueryClient } from '@tanstack/react-query';

import { PageHeading } from '@/components/ui/page-heading';
import { getMyDocumentsQueryOptions } from '@/features/handover/api/get-my-documents';
import { MyDocumentsList } from '@/features/handover/components/my-documents-list';

export function createLoader(queryClient: QueryClient) {
  return async () => {
    await queryClient.ensureQueryData(getMyDocumentsQueryOptions());
    return null;
  };
}

/** The homeowner's handover packs, from every home they are linked to. */
export function Component() {
  return (
    <>
      <title>Documents · Wardbook</title>
      <PageHeading title="Documents">
        <p>
          The handover packs for your homes. Each is sealed when issued: its verification page shows
          whether a copy is genuine and still valid.
        </p>
      </PageHeading>
      <MyDocumentsList />
    </>
  );
}
