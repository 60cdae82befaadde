import { KeyRound } from 'lucide-react';

import { DataTable } from '@/components/ui/data-table';
import { LoadingStatus } from '@/components/ui/loading-status';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { useSealKeys } from '@/features/handover/api/get-seal-keys';
import { formatDateTime } from '@/utils/format';

/**
 * Every installer's sealing public keys, so a seal can be checked with tools other than
 * Wardbook's own. Extra reading: the page works whether or not the list arrives.
 */
export function PublishedSealKeys() {
  const sealKeys = useSealKeys();
  return (
    <section aria-labelledby="seal-keys-heading" className="grid gap-3">
      <h2 id="seal-keys-heading" className="flex items-center gap-2 text-xl font-semibold">
        <KeyRound aria-hidden="true" className="size-6 shrink-0" />
        Published sealing keys
      </h2>
      <p className="max-w-prose text-sm text-ink-muted">
        Each alarm company seals its packs with an Ed25519 key. Retired keys stay listed, so packs
        sealed before a change of key can still be checked.
      </p>
      {sealKeys.isPending ? <LoadingStatus label="Loading the keys" /> : null}
      {sealKeys.isError ? <ProblemAlert error={sealKeys.error} /> : null}
      {sealKeys.data ? (
        <div className="overflow-hidden rounded-lg border border-hairline bg-white">
          <DataTable
            caption="Published sealing keys"
            rows={sealKeys.data}
            rowKey={(key) => key.keyId}
            emptyMessage="No keys are published yet."
            columns={[
              { header: 'Alarm company', isRowHeader: true, cell: (key) => key.organisation },
              {
                header: 'Key id',
                cell: (key) => <span className="font-mono break-all">{key.keyId}</span>,
              },
              {
                header: 'In use',
                cell: (key) => (
                  <>
                    From <time dateTime={key.createdAt}>{formatDateTime(key.createdAt)}</time>
                    {key.retiredAt ? (
                      <>
                        {' '}
                        to <time dateTime={key.retiredAt}>{formatDateTime(key.retiredAt)}</time>
                      </>
                    ) : (
                      ', still current'
                    )}
                  </>
                ),
              },
              {
                header: 'Public key',
                cell: (key) => <span className="font-mono text-xs break-all">{key.publicKey}</span>,
              },
            ]}
          />
        </div>
      ) : null}
    </section>
  );
}
