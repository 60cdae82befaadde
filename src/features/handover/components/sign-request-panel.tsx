import { CircleCheck, FileText } from 'lucide-react';
import { Link } from 'react-router-dom';

import { DetailItem } from '@/components/ui/detail-item';
import { buttonClassName } from '@/components/ui/button-styles';
import { paths } from '@/config/paths';
import { useSignRequest, useSigningRequest } from '@/features/handover/api/signing-request';
import { PackPreview } from '@/features/handover/components/pack-preview';
import { SignatureForm } from '@/features/handover/components/signature-form';
import { VariationsToAccept } from '@/features/handover/components/variations-to-accept';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';

type SignRequestPanelProps = {
  requestId: string;
  /** The signed-in homeowner's name, to start the name field with. */
  signerName: string;
};

const confirmationHeadingId = 'signed-confirmation-heading';

/**
 * A homeowner countersigning on their own phone: who installed what, the variations they
 * accept, the pack to read first, and the signing box. Once signed, a confirmation.
 */
export function SignRequestPanel({ requestId, signerName }: SignRequestPanelProps) {
  const { data: request } = useSigningRequest(requestId);
  const focusAfterRender = useFocusAfterRender();
  const signRequest = useSignRequest({ onSuccess: () => focusAfterRender(confirmationHeadingId) });

  return (
    <div className="grid gap-8">
      <dl className="grid gap-3 rounded-lg border border-hairline bg-white p-4 sm:grid-cols-2">
        <DetailItem term="Home">{request.siteName}</DetailItem>
        <DetailItem term="Engineer">{request.engineerName ?? 'Not recorded'}</DetailItem>
      </dl>

      {request.signed ? (
        <section
          aria-labelledby={confirmationHeadingId}
          className="grid gap-3 rounded-lg border border-l-4 border-hairline border-l-normal bg-white p-4"
        >
          <h2
            id={confirmationHeadingId}
            tabIndex={-1}
            className="flex items-center gap-2 text-xl font-semibold"
          >
            <CircleCheck aria-hidden="true" className="size-6 shrink-0 text-normal" />
            You have signed the handover
          </h2>
          <p>
            Thank you. Your alarm company can now issue the handover pack for {request.siteName}. It
            will be e-mailed to you and kept under Documents.
          </p>
          <div>
            <Link to={paths.documents.getHref()} className={buttonClassName({ size: 'lg' })}>
              <FileText aria-hidden="true" className="size-5" />
              Go to your documents
            </Link>
          </div>
        </section>
      ) : (
        <>
          <VariationsToAccept variations={request.variations} signer="you" headingLevel={2} />
          <PackPreview previewUrl={request.previewUrl} />
          <section aria-labelledby="sign-heading" className="grid gap-4">
            <h2 id="sign-heading" className="text-xl font-semibold">
              Sign
            </h2>
            <SignatureForm
              signer="self"
              headingId="sign-heading"
              nameField={{ label: 'Your full name', defaultName: signerName }}
              padLabel="Your signature"
              subject="Your signature"
              submitLabel="Sign"
              statement={
                <p>
                  By signing you confirm the system was handed over to you
                  {request.variations.length > 0 ? ' and accept the variations listed above' : ''}.
                </p>
              }
              onSign={(signature) => signRequest.mutateAsync({ requestId, signature })}
            />
          </section>
        </>
      )}
    </div>
  );
}
