import { useRef, useState } from 'react';
import { ShieldAlert } from 'lucide-react';

import type { HandoverState } from '@server/handover/schema';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { LiveMessage } from '@/components/ui/live-message';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { handoverPreviewUrl } from '@/features/handover/api/get-pack-pdf';
import { useClearSignatures } from '@/features/handover/api/sign-handover';
import { CustomerSignatureCard } from '@/features/handover/components/customer-signature-card';
import { EngineerSignatureCard } from '@/features/handover/components/engineer-signature-card';
import { IssuePackSection } from '@/features/handover/components/issue-pack-section';
import { IssuedPacks } from '@/features/handover/components/issued-packs';
import { PackPreview } from '@/features/handover/components/pack-preview';
import { PreIssueStatus } from '@/features/handover/components/pre-issue-status';
import {
  VariationsEditor,
  type VariationsEditorHandle,
} from '@/features/handover/components/variations-editor';

type HandoverWorkspaceProps = {
  siteId: string;
  state: HandoverState;
  /** The signed-in person, who signs as the engineer. */
  signerName: string;
  commissioningHref: string;
  /** Office staff may revoke an issued pack. */
  canRevoke: boolean;
  /** An engineer of the installer: signs as the engineer, has the customer sign, and issues. */
  isSiteEngineer: boolean;
};

/**
 * The handover, top to bottom in the order it is done: what still blocks the pack, the
 * variations, a preview, both signatures, then issue, and the packs issued so far.
 */
export function HandoverWorkspace({
  siteId,
  state,
  signerName,
  commissioningHref,
  canRevoke,
  isSiteEngineer,
}: HandoverWorkspaceProps) {
  const variationsEditor = useRef<VariationsEditorHandle>(null);
  const [message, setMessage] = useState('');
  const clearSignatures = useClearSignatures({
    onSuccess: () => setMessage('Both signatures are removed; signing starts again.'),
  });
  const { draft } = state;
  const hasSignature = draft.engineerSignature !== null || draft.customerSignature !== null;

  return (
    <div className="mx-auto grid max-w-3xl gap-8">
      <p className="flex items-start gap-3 rounded-lg border border-ink bg-white p-4 text-sm">
        <ShieldAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-ink" />
        <span>
          The pack carries the safety and working-at-height cautions for the homeowner. Go through
          them with the customer at handover; local codes and licensed practice come first.
        </span>
      </p>

      <PreIssueStatus
        blocking={state.blocking}
        commissioningHref={commissioningHref}
        onWriteAsVariation={(problem) => variationsEditor.current?.addVariation(problem)}
      />

      <VariationsEditor ref={variationsEditor} siteId={siteId} draft={draft} />

      <PackPreview previewUrl={handoverPreviewUrl(siteId)} />

      <section aria-labelledby="signatures-heading" className="grid gap-4">
        <div>
          <h2 id="signatures-heading" className="text-xl font-semibold">
            Signatures
          </h2>
          <p className="max-w-prose text-sm text-ink-muted">
            The engineer and the customer both sign. Their drawn signatures go on the sign-off page
            of the pack.
          </p>
        </div>
        <EngineerSignatureCard
          siteId={siteId}
          draft={draft}
          signerName={signerName}
          canSign={isSiteEngineer}
          announce={setMessage}
        />
        <CustomerSignatureCard
          siteId={siteId}
          state={state}
          canSignInPerson={isSiteEngineer}
          announce={setMessage}
        />
        {hasSignature ? (
          <div className="grid gap-2">
            {clearSignatures.isError ? <ProblemAlert error={clearSignatures.error} /> : null}
            <div className="flex flex-wrap">
              <ConfirmButton
                size="lg"
                question="Remove both signatures and start signing again? The engineer and the customer will both need to sign again."
                confirmLabel="Yes, remove both signatures"
                cancelLabel="Keep the signatures"
                pending={clearSignatures.isPending}
                onConfirm={() => clearSignatures.mutate({ siteId })}
              >
                Start signing again
              </ConfirmButton>
            </div>
          </div>
        ) : null}
      </section>

      <IssuePackSection siteId={siteId} state={state} canIssueAsEngineer={isSiteEngineer} />

      <IssuedPacks packs={state.packs} canRevoke={canRevoke} />

      <LiveMessage message={message} />
    </div>
  );
}
