import { useRef, useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { Ban, FileStack } from 'lucide-react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import { revokeInputSchema, type PackSummary } from '@server/handover/schema';
import { InPlaceFormSection } from '@/components/forms/in-place-form-section';
import { InPlaceRecordForm } from '@/components/forms/in-place-record-form';
import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { LiveMessage } from '@/components/ui/live-message';
import { touchTextareaClassName } from '@/components/ui/touch-field-styles';
import { useRevokePack } from '@/features/handover/api/revoke-pack';
import { PackLinks } from '@/features/handover/components/pack-links';
import { PackStatusLabel } from '@/features/handover/components/pack-status-label';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { formatFileSize } from '@/lib/file-size';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import { useInPlaceForm } from '@/lib/use-in-place-form';
import { formatDateTime } from '@/utils/format';

type IssuedPacksProps = {
  packs: readonly PackSummary[];
  /** Office staff may revoke a valid pack. */
  canRevoke: boolean;
};

/** Every pack issued for this site, newest first, with its status in words and an icon. */
export function IssuedPacks({ packs, canRevoke }: IssuedPacksProps) {
  const [message, setMessage] = useState('');
  const sorted = [...packs].sort((a, b) => b.issuedAt.localeCompare(a.issuedAt));
  return (
    <section aria-labelledby="issued-packs-heading" className="grid gap-4">
      <h2 id="issued-packs-heading" className="flex items-center gap-2 text-xl font-semibold">
        <FileStack aria-hidden="true" className="size-6 shrink-0" />
        Issued packs
      </h2>
      {sorted.length === 0 ? (
        <p className="rounded-lg border border-dashed border-hairline bg-white px-4 py-6 text-center text-ink-muted">
          No pack has been issued for this site yet.
        </p>
      ) : (
        <ul
          aria-label="Issued packs"
          className="divide-y divide-hairline rounded-lg border border-hairline bg-white"
        >
          {sorted.map((pack) => (
            <IssuedPackItem
              key={pack.packNumber}
              pack={pack}
              canRevoke={canRevoke}
              announce={setMessage}
            />
          ))}
        </ul>
      )}
      <LiveMessage message={message} />
    </section>
  );
}

type IssuedPackItemProps = {
  pack: PackSummary;
  canRevoke: boolean;
  announce: (message: string) => void;
};

function IssuedPackItem({ pack, canRevoke, announce }: IssuedPackItemProps) {
  const revokeButtonRef = useRef<HTMLButtonElement>(null);
  const { isOpen, open, close } = useInPlaceForm(revokeButtonRef);
  const focusAfterRender = useFocusAfterRender();
  const packHeadingId = `pack-${pack.packNumber}-heading`;

  return (
    <li className="grid gap-3 px-4 py-4 md:px-5">
      <div className="flex flex-wrap items-baseline gap-x-4 gap-y-1">
        <h3 id={packHeadingId} tabIndex={-1} className="font-mono text-lg font-semibold">
          {pack.packNumber}
        </h3>
        <PackStatusLabel
          status={pack.status}
          supersededBy={pack.supersededBy}
          revokedReason={pack.revokedReason}
        />
      </div>
      <p className="text-sm text-ink-muted">
        Revision {pack.revision} · Issued{' '}
        <time dateTime={pack.issuedAt}>{formatDateTime(pack.issuedAt)}</time> by {pack.issuedBy} ·{' '}
        <span className="font-mono">{formatFileSize(pack.sizeBytes)}</span>
      </p>
      <p className="text-sm">
        <span className="text-ink-muted">SHA-256 </span>
        <span className="font-mono break-all">{pack.sha256}</span>
      </p>
      <PackLinks pack={pack}>
        {canRevoke && pack.status === 'valid' && !isOpen ? (
          <Button ref={revokeButtonRef} variant="secondary" size="lg" onClick={open}>
            <Ban aria-hidden="true" className="size-5" />
            Revoke <span className="sr-only">pack {pack.packNumber}</span>
          </Button>
        ) : null}
      </PackLinks>
      {isOpen ? (
        <InPlaceFormSection title={`Revoke pack ${pack.packNumber}`} headingLevel={4}>
          {(headingId) => (
            <RevokePackForm
              pack={pack}
              headingId={headingId}
              onRevoked={() => {
                // A revoked pack has no Revoke button to go back to: its heading takes focus.
                focusAfterRender(packHeadingId);
                close();
                announce(`Pack ${pack.packNumber} is revoked.`);
              }}
              onCancel={close}
            />
          )}
        </InPlaceFormSection>
      ) : null}
    </li>
  );
}

type RevokeFormValues = z.input<typeof revokeInputSchema>;

function RevokePackForm({
  pack,
  headingId,
  onRevoked,
  onCancel,
}: {
  pack: PackSummary;
  headingId: string;
  onRevoked: () => void;
  onCancel: () => void;
}) {
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const form = useForm<RevokeFormValues, unknown, z.output<typeof revokeInputSchema>>({
    resolver: zodResolver(revokeInputSchema),
    defaultValues: { reason: '' },
  });
  const { errors } = form.formState;
  const revokePack = useRevokePack({
    onSuccess: onRevoked,
    onError: (error) =>
      setUnplacedMessages(
        applyServerFieldErrors(error, form.setError, (field) => field === 'reason'),
      ),
  });

  return (
    <InPlaceRecordForm
      form={form}
      headingId={headingId}
      firstField="reason"
      onSubmit={({ reason }) => {
        setUnplacedMessages([]);
        revokePack.mutate({ packNumber: pack.packNumber, reason });
      }}
      subject={`The revocation of ${pack.packNumber}`}
      error={revokePack.error}
      unplacedMessages={unplacedMessages}
      saveLabel={`Revoke pack ${pack.packNumber}`}
      isSaving={revokePack.isPending}
      onCancel={onCancel}
    >
      <p className="max-w-prose text-sm text-ink-muted">
        A revoked pack stays on record, and its verification page says it is revoked and why. Anyone
        checking it is told not to rely on it. This cannot be undone.
      </p>
      <FormField label="Reason for revoking" error={errors.reason?.message}>
        {(fieldProps) => (
          <textarea
            {...fieldProps}
            {...form.register('reason')}
            rows={3}
            className={touchTextareaClassName({
              invalid: Boolean(errors.reason),
              className: 'min-h-24',
            })}
          />
        )}
      </FormField>
    </InPlaceRecordForm>
  );
}
