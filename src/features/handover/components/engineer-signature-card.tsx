import { CircleDashed, PenLine } from 'lucide-react';

import type { HandoverState } from '@server/handover/schema';
import { useSignAsEngineer } from '@/features/handover/api/sign-handover';
import { SignatureForm } from '@/features/handover/components/signature-form';
import { SignatureSection } from '@/features/handover/components/signature-section';

type EngineerSignatureCardProps = {
  siteId: string;
  draft: HandoverState['draft'];
  /** The signed-in person, who signs as themselves. */
  signerName: string;
  /** Only an engineer of the installer signs as the engineer; office staff see who is to. */
  canSign: boolean;
  announce: (message: string) => void;
};

export function EngineerSignatureCard({
  siteId,
  draft,
  signerName,
  canSign,
  announce,
}: EngineerSignatureCardProps) {
  const signAsEngineer = useSignAsEngineer({
    onSuccess: () => announce('The engineer’s signature is saved.'),
  });

  return (
    <SignatureSection
      headingId="engineer-signature-heading"
      title="Engineer’s signature"
      icon={PenLine}
      signed={draft.engineerSignature}
    >
      {canSign ? (
        <SignatureForm
          signer="engineer"
          headingId="engineer-signature-heading"
          padLabel="Engineer’s signature"
          padLabelVisuallyHidden
          subject="The engineer’s signature"
          submitLabel="Save the engineer’s signature"
          statement={
            <p className="text-sm text-ink-muted">
              You sign as <span className="font-semibold text-ink">{signerName}</span>, to say the
              system was installed, tested and commissioned as the pack records.
            </p>
          }
          onSign={({ image }) => signAsEngineer.mutateAsync({ siteId, image })}
        />
      ) : (
        <p className="flex items-start gap-2">
          <CircleDashed aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-info" />
          Not signed yet. The engineer who commissioned the system signs here, on their own account.
        </p>
      )}
    </SignatureSection>
  );
}
