import { useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheck, Home, MailPlus, UserMinus } from 'lucide-react';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';

import type { SiteDetail } from '@server/sites/schema';
import { describeError } from '@/components/errors/describe-error';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormField } from '@/components/ui/form-field';
import { inputClassName } from '@/components/ui/form-styles';
import { Notice } from '@/components/ui/notice';
import {
  inviteHomeownerSchema,
  useInviteHomeowner,
  type InviteHomeownerValues,
} from '@/features/sites/api/invite-homeowner';
import { useRemoveHomeowner } from '@/features/sites/api/remove-homeowner';
import { applyServerFieldErrors } from '@/lib/form-errors';

type Homeowner = SiteDetail['homeowners'][number];

function HomeownerRow({ siteId, homeowner }: { siteId: string; homeowner: Homeowner }) {
  const [isConfirming, setIsConfirming] = useState(false);
  const removeHomeowner = useRemoveHomeowner();

  return (
    <li className="flex flex-wrap items-center justify-between gap-3 py-3">
      <div className="min-w-0">
        <p className="font-medium">{homeowner.displayName}</p>
        <p className="text-sm break-all text-ink-muted">{homeowner.email}</p>
      </div>
      {isConfirming ? (
        <div
          className="flex flex-wrap items-center gap-2"
          role="group"
          aria-label="Confirm removal"
        >
          <span className="text-sm">
            Remove {homeowner.displayName}&rsquo;s access to this site?
          </span>
          <Button
            variant="secondary"
            disabled={removeHomeowner.isPending}
            onClick={() => removeHomeowner.mutate({ siteId, userId: homeowner.id })}
          >
            {removeHomeowner.isPending ? 'Removing…' : `Yes, remove ${homeowner.displayName}`}
          </Button>
          <Button variant="secondary" onClick={() => setIsConfirming(false)}>
            Keep
          </Button>
        </div>
      ) : (
        <Button
          variant="secondary"
          aria-label={`Remove ${homeowner.displayName}`}
          onClick={() => setIsConfirming(true)}
        >
          <UserMinus aria-hidden="true" className="size-4" />
          Remove
        </Button>
      )}
      {removeHomeowner.isError ? (
        <p role="alert" className="w-full text-sm font-medium text-alarm">
          {describeError(removeHomeowner.error).message}
        </p>
      ) : null}
    </li>
  );
}

function InviteHomeownerForm({ siteId }: { siteId: string }) {
  const [sentTo, setSentTo] = useState<InviteHomeownerValues | null>(null);
  const form = useForm<z.input<typeof inviteHomeownerSchema>, unknown, InviteHomeownerValues>({
    resolver: zodResolver(inviteHomeownerSchema),
    defaultValues: { displayName: '', email: '' },
  });
  const inviteHomeowner = useInviteHomeowner({
    onSuccess: (_site, { values }) => {
      setSentTo(values);
      form.reset();
    },
    onError: (error) => applyServerFieldErrors(error, form.setError),
  });
  const { errors } = form.formState;

  return (
    <form
      noValidate
      className="grid gap-4"
      onSubmit={form.handleSubmit((values) => {
        setSentTo(null);
        inviteHomeowner.mutate({ siteId, values });
      })}
    >
      <h3 className="font-semibold">Invite a homeowner</h3>
      <div className="grid gap-4">
        <FormField label="Full name" error={errors.displayName?.message}>
          {(field) => (
            <input
              {...field}
              {...form.register('displayName')}
              className={inputClassName()}
              autoComplete="off"
            />
          )}
        </FormField>
        <FormField label="E-mail address" error={errors.email?.message}>
          {(field) => (
            <input
              {...field}
              {...form.register('email')}
              type="email"
              className={inputClassName()}
              autoComplete="off"
              spellCheck={false}
            />
          )}
        </FormField>
      </div>
      {inviteHomeowner.isError && !(errors.displayName || errors.email) ? (
        <div role="alert">
          <Notice tone="alarm" title="The invitation was not sent">
            {describeError(inviteHomeowner.error).message}
          </Notice>
        </div>
      ) : null}
      <div>
        <Button type="submit" variant="secondary" disabled={inviteHomeowner.isPending}>
          <MailPlus aria-hidden="true" className="size-4" />
          {inviteHomeowner.isPending ? 'Sending…' : 'Invite homeowner'}
        </Button>
      </div>
      <div role="status">
        {sentTo ? (
          <p className="flex items-start gap-2 text-sm font-medium text-normal">
            <CircleCheck aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
            <span>
              Invitation sent. {sentTo.displayName} will get an e-mail at {sentTo.email} with a link
              to set a password.
            </span>
          </p>
        ) : null}
      </div>
    </form>
  );
}

type SiteHomeownersProps = { site: SiteDetail; canManage: boolean };

/** Who owns the home. The office invites and removes them; engineers see who they are. */
export function SiteHomeowners({ site, canManage }: SiteHomeownersProps) {
  return (
    <Card title="Homeowners" icon={Home}>
      {site.homeowners.length === 0 ? (
        <p className="text-sm text-ink-muted">No homeowner is linked to this site yet.</p>
      ) : canManage ? (
        <ul className="divide-y divide-hairline">
          {site.homeowners.map((homeowner) => (
            <HomeownerRow key={homeowner.id} siteId={site.id} homeowner={homeowner} />
          ))}
        </ul>
      ) : (
        <ul className="divide-y divide-hairline">
          {site.homeowners.map((homeowner) => (
            <li key={homeowner.id} className="py-2">
              <p className="font-medium">{homeowner.displayName}</p>
              <p className="text-sm break-all text-ink-muted">{homeowner.email}</p>
            </li>
          ))}
        </ul>
      )}
      {canManage ? (
        <div className="mt-4 border-t border-hairline pt-4">
          <InviteHomeownerForm siteId={site.id} />
        </div>
      ) : null}
    </Card>
  );
}
