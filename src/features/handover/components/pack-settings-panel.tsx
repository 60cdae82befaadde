import { useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { Hash, KeyRound, RefreshCw } from 'lucide-react';
import { useForm, useWatch } from 'react-hook-form';
import type { z } from 'zod';

import { packSettingsInputSchema, type PackSettings } from '@server/handover/schema';
import { SaveRow } from '@/components/forms/save-row';
import { Card } from '@/components/ui/card';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { DataTable, type DataTableColumn } from '@/components/ui/data-table';
import { FormField } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { LiveMessage } from '@/components/ui/live-message';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import {
  usePackSettings,
  useRotateSealKey,
  useUpdatePackSettings,
} from '@/features/handover/api/pack-settings';
import { nextPackNumberPreview } from '@/features/handover/utils/pack-numbers';
import { applyServerFieldErrors, countFieldErrors } from '@/lib/form-errors';
import { useUnsavedChangesGuard } from '@/lib/use-unsaved-changes-guard';
import { formatDateTime } from '@/utils/format';

type SealKey = PackSettings['keys'][number];

/** Pack numbering and the sealing key, for the company's office staff. */
export function PackSettingsPanel() {
  const { data: settings } = usePackSettings();
  return (
    <div className="grid gap-6">
      <PackNumberingCard settings={settings} />
      <SealKeysCard settings={settings} />
    </div>
  );
}

type PrefixFormValues = z.input<typeof packSettingsInputSchema>;

function PackNumberingCard({ settings }: { settings: PackSettings }) {
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const [savedMessage, setSavedMessage] = useState('');
  const form = useForm<PrefixFormValues, unknown, z.output<typeof packSettingsInputSchema>>({
    resolver: zodResolver(packSettingsInputSchema),
    defaultValues: { prefix: settings.prefix },
  });
  const { errors, isDirty, submitCount } = form.formState;
  const prefixTyped = useWatch({ control: form.control, name: 'prefix' });
  const preview = nextPackNumberPreview(prefixTyped, settings.nextNumber);

  const updateSettings = useUpdatePackSettings({
    onSuccess: (saved) => {
      form.reset({ prefix: saved.prefix });
      setSavedMessage('Pack numbering saved.');
    },
    onError: (error) =>
      setUnplacedMessages(
        applyServerFieldErrors(error, form.setError, (field) => field === 'prefix'),
      ),
  });
  useUnsavedChangesGuard(isDirty && !updateSettings.isPending);

  const submit = form.handleSubmit(({ prefix }) => {
    setUnplacedMessages([]);
    setSavedMessage('');
    updateSettings.mutate({ prefix });
  });

  return (
    <Card title="Pack numbering" icon={Hash} headingLevel={3}>
      <form noValidate onSubmit={submit} aria-label="Pack numbering" className="grid gap-4">
        <p className="max-w-prose text-sm text-ink-muted">
          Every pack gets the next number in an unbroken run, after your prefix. A correction keeps
          the number and goes up a revision (R2, R3 and so on). A new prefix applies from the next
          pack; packs already issued keep their numbers.
        </p>
        <FormProblem
          key={submitCount}
          subject="The pack numbering"
          fieldErrorCount={countFieldErrors(errors)}
          error={updateSettings.error}
          unplacedMessages={unplacedMessages}
        />
        <FormField
          label="Prefix"
          hint="2 to 6 capital letters, such as your company’s initials."
          error={errors.prefix?.message}
        >
          {(fieldProps) => (
            <input
              {...fieldProps}
              {...form.register('prefix')}
              type="text"
              autoComplete="off"
              autoCapitalize="characters"
              spellCheck={false}
              maxLength={6}
              className={touchInputClassName({
                invalid: Boolean(errors.prefix),
                className: 'max-w-40 font-mono uppercase',
              })}
            />
          )}
        </FormField>
        <p aria-live="polite" className="text-sm">
          {preview ? (
            <>
              Next pack: <span className="font-mono font-semibold">{preview}</span>
            </>
          ) : (
            'Next pack: type a prefix of 2 to 6 letters to see its number.'
          )}
        </p>
        <SaveRow
          saveLabel="Save pack numbering"
          isSaving={updateSettings.isPending}
          savedMessage={isDirty ? '' : savedMessage}
        />
      </form>
    </Card>
  );
}

/** The newest key that has not been retired is the one new packs are sealed with. */
function currentKeyId(keys: readonly SealKey[]): string | null {
  const inUse = keys
    .filter((key) => key.retiredAt === null)
    .sort((a, b) => b.createdAt.localeCompare(a.createdAt));
  return inUse[0]?.keyId ?? null;
}

function SealKeysCard({ settings }: { settings: PackSettings }) {
  const [message, setMessage] = useState('');
  const rotateKey = useRotateSealKey({
    onSuccess: (next) => {
      const current = currentKeyId(next.keys);
      setMessage(current ? `New sealing key ${current} is in use.` : 'The sealing key is rotated.');
    },
  });
  const current = currentKeyId(settings.keys);
  const keys = [...settings.keys].sort((a, b) => b.createdAt.localeCompare(a.createdAt));

  const columns: DataTableColumn<SealKey>[] = [
    {
      header: 'Key id',
      isRowHeader: true,
      cell: (key) => (
        <span className="grid gap-1">
          <span className="font-mono break-all">{key.keyId}</span>
          {key.keyId === current ? (
            <span className="inline-flex items-center gap-1 text-sm font-semibold">
              <KeyRound aria-hidden="true" className="size-4 shrink-0 text-normal" />
              Current key
            </span>
          ) : null}
        </span>
      ),
    },
    {
      header: 'Created',
      cell: (key) => <time dateTime={key.createdAt}>{formatDateTime(key.createdAt)}</time>,
    },
    {
      header: 'Retired',
      cell: (key) =>
        key.retiredAt ? (
          <time dateTime={key.retiredAt}>{formatDateTime(key.retiredAt)}</time>
        ) : (
          'Not retired'
        ),
    },
    {
      header: 'Public key',
      cell: (key) => <span className="font-mono text-xs break-all">{key.publicKey}</span>,
    },
  ];

  return (
    <Card title="Sealing key" icon={KeyRound} headingLevel={3} flush>
      <div className="grid gap-3 px-4 py-4 md:px-5">
        <p className="max-w-prose text-sm text-ink-muted">
          Each pack is sealed with an Ed25519 signature made with your company’s current private
          key. The public keys are published, so anyone can check a seal on the pack’s verification
          page.
        </p>
      </div>
      <DataTable
        caption="Sealing keys, newest first"
        columns={columns}
        rows={keys}
        rowKey={(key) => key.keyId}
        emptyMessage="No sealing key yet: one is made when the first pack is issued."
      />
      <div className="grid gap-3 border-t border-hairline px-4 py-4 md:px-5">
        {rotateKey.isError ? <ProblemAlert error={rotateKey.error} /> : null}
        <div className="flex flex-wrap">
          <ConfirmButton
            size="lg"
            question="Rotate the sealing key? Packs from now on are sealed with a new key. Packs already issued stay verifiable: their seals are checked with the old public key, which stays published. Rotate if the old key may have been exposed, or as routine."
            confirmLabel="Yes, rotate the key"
            cancelLabel="Keep the current key"
            pending={rotateKey.isPending}
            onConfirm={() => rotateKey.mutate()}
          >
            <RefreshCw aria-hidden="true" className="size-5" />
            Rotate the sealing key
          </ConfirmButton>
        </div>
      </div>
      <LiveMessage message={message} />
    </Card>
  );
}
