import { useId, useState } from 'react';
import { zodResolver } from '@hookform/resolvers/zod';
import { CircleCheck, CircleDashed, Mail, Signature, UserRound } from 'lucide-react';
import { useForm, useWatch } from 'react-hook-form';
import { z } from 'zod';

import type { HandoverState } from '@server/handover/schema';
import { Button } from '@/components/ui/button';
import { FieldErrorMessage } from '@/components/ui/form-field';
import { FormProblem } from '@/components/ui/form-problem';
import { Notice } from '@/components/ui/notice';
import { useSendSigningRequest, useSignAsCustomer } from '@/features/handover/api/sign-handover';
import { SignatureForm } from '@/features/handover/components/signature-form';
import { SignatureSection } from '@/features/handover/components/signature-section';
import { VariationsToAccept } from '@/features/handover/components/variations-to-accept';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { cn } from '@/utils/cn';
import { formatDateTime } from '@/utils/format';

type SigningWay = 'in_person' | 'request';

const WAY_LABELS: Record<SigningWay, string> = {
  in_person: 'Sign here, in person',
  request: 'Send a signing request',
};

const WAY_HINTS: Record<SigningWay, string> = {
  in_person: 'Hand this phone or tablet to the customer to sign now.',
  request: 'E-mail a homeowner a link to read the variations and sign on their own phone.',
};

type CustomerSignatureCardProps = {
  siteId: string;
  state: HandoverState;
  /** Signing in person happens on an engineer's device; office staff can only send a request. */
  canSignInPerson: boolean;
  announce: (message: string) => void;
};

const radioCard = (checked: boolean) =>
  cn(
    'flex min-h-12 cursor-pointer items-start gap-3 rounded-md border bg-white p-3',
    checked ? 'border-2 border-ink' : 'border-hairline hover:border-ink',
  );

/** The customer's countersignature: in person on this device, or by an e-mailed request. */
export function CustomerSignatureCard({
  siteId,
  state,
  canSignInPerson,
  announce,
}: CustomerSignatureCardProps) {
  const { draft, homeowners } = state;
  const [chosenWay, setWay] = useState<SigningWay>(draft.signingRequest ? 'request' : 'in_person');
  const way: SigningWay = canSignInPerson ? chosenWay : 'request';
  const idPrefix = useId();
  const signAsCustomer = useSignAsCustomer({
    onSuccess: () => announce('The customer’s signature is saved.'),
  });
  const signature = draft.customerSignature;

  return (
    <SignatureSection
      headingId="customer-signature-heading"
      title="Customer’s signature"
      icon={Signature}
      signed={
        signature && {
          ...signature,
          how: signature.via === 'in_person' ? 'in person' : 'through a signing request',
        }
      }
    >
      {canSignInPerson ? (
        <fieldset className="grid gap-2">
          <legend className="mb-2 font-semibold">How will the customer sign?</legend>
          {(['in_person', 'request'] as const).map((option) => (
            <label key={option} className={radioCard(way === option)}>
              {/* Named by its title alone; the hint describes it. */}
              <input
                type="radio"
                name="customer-signing-way"
                value={option}
                checked={way === option}
                onChange={() => setWay(option)}
                aria-labelledby={`${idPrefix}-${option}-title`}
                aria-describedby={`${idPrefix}-${option}-hint`}
                className="mt-1 size-5 shrink-0 accent-ink"
              />
              <span>
                <span id={`${idPrefix}-${option}-title`} className="block font-semibold">
                  {WAY_LABELS[option]}
                </span>
                <span id={`${idPrefix}-${option}-hint`} className="block text-sm text-ink-muted">
                  {WAY_HINTS[option]}
                </span>
              </span>
            </label>
          ))}
        </fieldset>
      ) : (
        <p className="text-sm text-ink-muted">
          To have the customer sign in person, open this page as an engineer on site. From here you
          can send them a signing request.
        </p>
      )}
      {draft.signingRequest ? <SigningRequestStatus request={draft.signingRequest} /> : null}
      {way === 'in_person' ? (
        <section aria-labelledby="sign-in-person-heading" className="grid gap-4">
          <h4 id="sign-in-person-heading" className="font-semibold">
            Sign here, in person
          </h4>
          <VariationsToAccept
            variations={draft.variations}
            signer="the customer"
            headingLevel={5}
          />
          <SignatureForm
            signer="customer"
            headingId="sign-in-person-heading"
            nameField={{
              label: 'Customer’s full name',
              defaultName: homeowners[0]?.name ?? '',
            }}
            padLabel="Customer’s signature"
            subject="The customer’s signature"
            submitLabel="Save the customer’s signature"
            statement={
              <p className="text-sm text-ink-muted">
                Signing confirms the system was handed over and explained, and accepts the
                variations listed above.
              </p>
            }
            onSign={(signature) => signAsCustomer.mutateAsync({ siteId, signature })}
          />
        </section>
      ) : (
        <SigningRequestForm siteId={siteId} state={state} announce={announce} />
      )}
    </SignatureSection>
  );
}

function SigningRequestStatus({
  request,
}: {
  request: NonNullable<HandoverState['draft']['signingRequest']>;
}) {
  return (
    <div className="grid gap-1 rounded-md border border-hairline bg-paper p-3">
      <p className="flex items-start gap-2">
        <Mail aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-info" />
        <span>
          Signing request sent to <span className="font-semibold break-all">{request.sentTo}</span>,{' '}
          <time dateTime={request.sentAt}>{formatDateTime(request.sentAt)}</time>.
        </span>
      </p>
      <p className="flex items-center gap-2 font-medium">
        {request.signed ? (
          <>
            <CircleCheck aria-hidden="true" className="size-5 shrink-0 text-normal" />
            Signed
          </>
        ) : (
          <>
            <CircleDashed aria-hidden="true" className="size-5 shrink-0 text-info" />
            Not signed yet
          </>
        )}
      </p>
    </div>
  );
}

const signingRequestFormSchema = z.object({
  homeownerUserId: z.string({ error: 'Choose who to send the request to.' }).min(1, {
    error: 'Choose who to send the request to.',
  }),
});
type SigningRequestFormValues = z.input<typeof signingRequestFormSchema>;

function SigningRequestForm({
  siteId,
  state,
  announce,
}: Omit<CustomerSignatureCardProps, 'canSignInPerson'>) {
  const { homeowners, draft } = state;
  const headingId = useId();
  const errorId = useId();
  const [unplacedMessages, setUnplacedMessages] = useState<string[]>([]);
  const form = useForm<SigningRequestFormValues>({
    resolver: zodResolver(signingRequestFormSchema),
    defaultValues: { homeownerUserId: homeowners.length === 1 ? homeowners[0]!.id : '' },
  });
  const { errors, submitCount } = form.formState;
  const chosen = useWatch({ control: form.control, name: 'homeownerUserId' });
  const sendRequest = useSendSigningRequest({
    onSuccess: (next) => {
      const sentTo = next.draft.signingRequest?.sentTo;
      announce(sentTo ? `Signing request e-mailed to ${sentTo}.` : 'Signing request sent.');
    },
    onError: (error) =>
      setUnplacedMessages(
        applyServerFieldErrors(error, form.setError, (field) => field === 'homeownerUserId'),
      ),
  });

  const submit = form.handleSubmit(({ homeownerUserId }) => {
    setUnplacedMessages([]);
    sendRequest.mutate({ siteId, homeownerUserId });
  });

  return (
    <section aria-labelledby={headingId} className="grid gap-4">
      <h4 id={headingId} className="font-semibold">
        Send a signing request
      </h4>
      {homeowners.length === 0 ? (
        <Notice tone="info" title="No homeowner to send it to">
          <p>
            Nobody has a homeowner’s account for this site yet. Invite the homeowner from the site’s
            Overview, or have the customer sign here in person.
          </p>
        </Notice>
      ) : (
        <form noValidate onSubmit={submit} aria-labelledby={headingId} className="grid gap-4">
          <FormProblem
            key={submitCount}
            subject="The signing request"
            fieldErrorCount={errors.homeownerUserId ? 1 : 0}
            error={sendRequest.error}
            unplacedMessages={unplacedMessages}
          />
          <fieldset
            className="grid gap-2"
            aria-describedby={errors.homeownerUserId ? errorId : undefined}
          >
            <legend className="mb-2 font-semibold">Send the request to</legend>
            {homeowners.map((homeowner) => (
              <label key={homeowner.id} className={radioCard(chosen === homeowner.id)}>
                <input
                  type="radio"
                  value={homeowner.id}
                  {...form.register('homeownerUserId')}
                  aria-labelledby={`${headingId}-${homeowner.id}-name`}
                  aria-describedby={`${headingId}-${homeowner.id}-email`}
                  className="mt-1 size-5 shrink-0 accent-ink"
                />
                <span className="min-w-0">
                  <span className="flex items-center gap-1.5 font-semibold">
                    <UserRound aria-hidden="true" className="size-4 shrink-0" />
                    <span id={`${headingId}-${homeowner.id}-name`}>{homeowner.name}</span>
                  </span>
                  <span
                    id={`${headingId}-${homeowner.id}-email`}
                    className="block text-sm break-all text-ink-muted"
                  >
                    {homeowner.email}
                  </span>
                </span>
              </label>
            ))}
            <FieldErrorMessage id={errorId} message={errors.homeownerUserId?.message} />
          </fieldset>
          <p className="max-w-prose text-sm text-ink-muted">
            They sign in to Wardbook, read the{' '}
            {draft.variations.length === 0 ? '' : 'variations and '}
            preview, and sign on their own phone. If the variations change afterwards, they will
            need to sign again.
          </p>
          <div>
            <Button type="submit" size="lg" disabled={sendRequest.isPending}>
              <Mail aria-hidden="true" className="size-5" />
              {sendRequest.isPending
                ? 'Sending…'
                : draft.signingRequest
                  ? 'Send the signing request again'
                  : 'Send signing request'}
            </Button>
          </div>
        </form>
      )}
    </section>
  );
}
