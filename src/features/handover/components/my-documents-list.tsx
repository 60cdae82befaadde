import type { PackSummary } from '@server/handover/schema';
import { FileText } from 'lucide-react';

import { useMyDocuments } from '@/features/handover/api/get-my-documents';
import { PackLinks } from '@/features/handover/components/pack-links';
import { PackStatusLabel } from '@/features/handover/components/pack-status-label';
import { groupPacksByHome, type PackDocument } from '@/features/handover/utils/pack-numbers';
import { formatFileSize } from '@/lib/file-size';
import { formatDateTime } from '@/utils/format';

/** Every handover pack of every home, each document once with its revisions under it. */
export function MyDocumentsList() {
  const { data: packs } = useMyDocuments();
  const homes = groupPacksByHome(packs);

  if (homes.length === 0) {
    return (
      <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
        No handover packs yet. Your alarm company issues one when your system is handed over, and it
        appears here and in your e-mail.
      </p>
    );
  }

  return (
    <div className="grid gap-8">
      {homes.map((home) => (
        <section
          key={home.siteId}
          aria-labelledby={`documents-${home.siteId}`}
          className="grid gap-4"
        >
          <h2 id={`documents-${home.siteId}`} className="text-xl font-semibold">
            {home.siteName}
          </h2>
          {home.documents.map((document) => (
            <DocumentCard key={document.documentNumber} document={document} />
          ))}
        </section>
      ))}
    </div>
  );
}

function DocumentCard({ document }: { document: PackDocument }) {
  const headingId = `document-${document.documentNumber}`;
  const count = document.revisions.length;
  return (
    <article
      aria-labelledby={headingId}
      className="overflow-hidden rounded-lg border border-hairline bg-white"
    >
      <div className="flex items-center gap-2 border-b border-hairline px-4 py-3">
        <FileText aria-hidden="true" className="size-5 shrink-0" />
        <h3 id={headingId} className="font-semibold">
          Handover pack <span className="font-mono">{document.documentNumber}</span>
        </h3>
      </div>
      {count > 1 ? (
        <p className="px-4 pt-3 text-sm text-ink-muted">
          {count} revisions, newest first. Only a valid revision should be relied on.
        </p>
      ) : null}
      <ol
        aria-label={`Revisions of ${document.documentNumber}`}
        className="divide-y divide-hairline"
      >
        {document.revisions.map((pack) => (
          <RevisionItem key={pack.packNumber} pack={pack} />
        ))}
      </ol>
    </article>
  );
}

function RevisionItem({ pack }: { pack: PackSummary }) {
  return (
    <li className="grid gap-3 px-4 py-4">
      <div className="grid gap-1">
        <p className="font-mono text-lg font-semibold">{pack.packNumber}</p>
        <PackStatusLabel
          status={pack.status}
          supersededBy={pack.supersededBy}
          revokedReason={pack.revokedReason}
        />
        <p className="text-sm text-ink-muted">
          Issued <time dateTime={pack.issuedAt}>{formatDateTime(pack.issuedAt)}</time> by{' '}
          {pack.issuedBy} · <span className="font-mono">{formatFileSize(pack.sizeBytes)}</span>
        </p>
      </div>
      <PackLinks pack={pack} downloadVariant={pack.status === 'valid' ? 'primary' : 'secondary'} />
    </li>
  );
}
