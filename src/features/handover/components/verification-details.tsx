import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ShieldCheck, ShieldX } from 'lucide-react';

import type { Verification } from '@server/handover/schema';
import { DetailItem } from '@/components/ui/detail-item';
import { Notice } from '@/components/ui/notice';
import { paths } from '@/config/paths';
import { PACK_STATUS_LOOKS } from '@/features/handover/components/pack-status-looks';
import { packStatusWords } from '@/features/handover/utils/pack-status';
import { formatFileSize } from '@/lib/file-size';
import { cn } from '@/utils/cn';
import { formatDateTime } from '@/utils/format';

const STATUS_EXPLANATIONS: Record<Verification['status'], string> = {
  valid: 'This is the current issue of this handover pack.',
  superseded: 'A newer revision replaces this pack. Rely on the newer one.',
  revoked: 'The alarm company has withdrawn this pack. Do not rely on it.',
};

/** A long value people may need to compare character by character: monospaced, free to wrap. */
function Code({ children }: { children: ReactNode }) {
  return <span className="font-mono text-sm break-all">{children}</span>;
}

/** The pack's status in large words with its icon: the first thing anyone checking needs. */
export function VerificationStatus({ verification }: { verification: Verification }) {
  const { status, supersededBy, revokedReason } = verification;
  const look = PACK_STATUS_LOOKS[status];
  return (
    <div
      className={cn(
        'grid gap-2 rounded-lg border border-l-8 border-hairline bg-white p-5',
        status === 'valid'
          ? 'border-l-normal'
          : status === 'revoked'
            ? 'border-l-alarm'
            : 'border-l-info',
      )}
    >
      <p className="flex items-start gap-3 text-2xl font-bold md:text-3xl">
        <look.icon aria-hidden="true" className={cn('mt-1 size-8 shrink-0', look.colour)} />
        <span className="break-words">{packStatusWords(status, supersededBy, revokedReason)}</span>
      </p>
      <p>{STATUS_EXPLANATIONS[status]}</p>
      {status === 'superseded' && supersededBy ? (
        <p>
          <Link
            to={paths.verify.pack.getHref(supersededBy)}
            className="inline-flex min-h-11 items-center font-semibold"
          >
            Check <span className="mx-1 font-mono">{supersededBy}</span> instead
          </Link>
        </p>
      ) : null}
    </div>
  );
}

/** Who issued the pack, when, for which site, and the hash of its exact bytes. */
export function VerificationFacts({ verification }: { verification: Verification }) {
  return (
    <section aria-labelledby="pack-facts-heading" className="grid gap-3">
      <h2 id="pack-facts-heading" className="text-xl font-semibold">
        About this pack
      </h2>
      <dl className="grid gap-4 rounded-lg border border-hairline bg-white p-4 sm:grid-cols-2 md:p-5">
        <DetailItem term="Installer">{verification.installer}</DetailItem>
        <DetailItem term="Issued">
          <time dateTime={verification.issuedAt}>{formatDateTime(verification.issuedAt)}</time> by{' '}
          {verification.issuedBy}
        </DetailItem>
        <DetailItem term="Site reference">
          <Code>{verification.site.reference}</Code>
        </DetailItem>
        <DetailItem term="Town">{verification.site.town}</DetailItem>
        <DetailItem term="Revision">{verification.revision}</DetailItem>
        <DetailItem term="File size">
          <span className="font-mono">{formatFileSize(verification.sizeBytes)}</span> (
          {verification.sizeBytes.toLocaleString('en-GB')} bytes)
        </DetailItem>
        <div className="min-w-0 sm:col-span-2">
          <dt className="text-sm text-ink-muted">SHA-256 of the issued PDF</dt>
          <dd>
            <Code>{verification.sha256}</Code>
          </dd>
        </div>
      </dl>
    </section>
  );
}

/** The seal: what was signed, with which key, and whether the signature checks out. */
export function VerificationSeal({ verification }: { verification: Verification }) {
  const { seal } = verification;
  return (
    <section aria-labelledby="seal-heading" className="grid gap-3">
      <h2 id="seal-heading" className="text-xl font-semibold">
        Seal
      </h2>
      {seal.valid ? (
        <Notice tone="normal" icon={ShieldCheck} title="Seal checks out">
          <p>
            The signature below was made over the signed text with the private key that matches this
            public key. The pack’s number and hash have not been altered since it was sealed.
          </p>
        </Notice>
      ) : (
        <Notice tone="alarm" icon={ShieldX} title="Seal does not check out">
          <p>
            The signature does not match the signed text and the public key. Do not rely on this
            pack; ask the alarm company that issued it.
          </p>
        </Notice>
      )}
      <dl className="grid gap-4 rounded-lg border border-hairline bg-white p-4 md:p-5">
        <DetailItem term="Algorithm">{seal.algorithm}</DetailItem>
        <DetailItem term="Key id">
          <Code>{seal.keyId}</Code>
        </DetailItem>
        <DetailItem term="Public key">
          <Code>{seal.publicKey}</Code>
        </DetailItem>
        <div className="min-w-0">
          <dt className="text-sm text-ink-muted">Signed text</dt>
          <dd>
            <pre className="mt-1 overflow-x-auto rounded-md border border-hairline bg-paper p-3 font-mono text-sm whitespace-pre-wrap break-all">
              {seal.signedText}
            </pre>
          </dd>
        </div>
        <DetailItem term="Signature">
          <Code>{seal.signature}</Code>
        </DetailItem>
      </dl>
    </section>
  );
}
