import type { ReactNode } from 'react';
import { CircleCheck, type LucideIcon } from 'lucide-react';

import { formatDateTime } from '@/utils/format';

type Signed = { name: string; signedAt: string; how?: string };

type SignatureSectionProps = {
  headingId: string;
  title: string;
  icon: LucideIcon;
  /** The signature already on the draft, if there is one. */
  signed: Signed | null;
  /** How to sign, shown while nobody has. */
  children: ReactNode;
};

/** One of the two signatures on the draft: who signed and when, or the way to sign. */
export function SignatureSection({
  headingId,
  title,
  icon: Icon,
  signed,
  children,
}: SignatureSectionProps) {
  return (
    <section
      aria-labelledby={headingId}
      className="grid gap-4 rounded-lg border border-hairline bg-white p-4 md:p-5"
    >
      <h3 id={headingId} className="flex items-center gap-2 text-lg font-semibold">
        <Icon aria-hidden="true" className="size-5 shrink-0" />
        {title}
      </h3>
      {signed ? (
        <p className="flex items-start gap-2 font-medium">
          <CircleCheck aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-normal" />
          <span>
            Signed by {signed.name},{' '}
            <time dateTime={signed.signedAt}>{formatDateTime(signed.signedAt)}</time>
            {signed.how ? ` (${signed.how})` : null}.
          </span>
        </p>
      ) : (
        children
      )}
    </section>
  );
}
