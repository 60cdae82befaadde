import { useEffect, useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Download, ShieldCheck } from 'lucide-react';
import { Link } from 'react-router-dom';

import { BUILD_STAGE_LABELS, type PackBuild } from '@server/handover/schema';
import { buttonClassName } from '@/components/ui/button-styles';
import { Notice } from '@/components/ui/notice';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { ProgressBar } from '@/components/ui/progress-bar';
import { paths } from '@/config/paths';
import { getHandoverQueryKey } from '@/features/handover/api/get-handover';
import { getMyDocumentsQueryKey } from '@/features/handover/api/get-my-documents';
import { packPdfUrl } from '@/features/handover/api/get-pack-pdf';

type BuildProgressProps = {
  siteId: string;
  /** The latest word on the build. */
  build: PackBuild;
  /** Why the last ask after it failed, if it did; asking goes on. */
  pollError: unknown;
};

/** What the live region says: the stage while running, then the outcome. A failure is an alert. */
function buildMessage(build: PackBuild): string {
  if (build.status === 'failed') return '';
  if (build.status === 'done') {
    return build.packNumber ? `Pack ${build.packNumber} issued.` : 'The pack is issued.';
  }
  return `${BUILD_STAGE_LABELS[build.stage]}…`;
}

/**
 * A pack on its way from "waiting to start" to issued. The bar shows the percentage; the live
 * region says each stage once, not every step of the bar.
 */
export function BuildProgress({ siteId, build, pollError }: BuildProgressProps) {
  const queryClient = useQueryClient();
  const refreshedFor = useRef<string | null>(null);

  // Once issued, the list of packs (here and in the homeowner's documents) has a new entry.
  useEffect(() => {
    if (build.status !== 'done' || refreshedFor.current === build.id) return;
    refreshedFor.current = build.id;
    void queryClient.invalidateQueries({ queryKey: getHandoverQueryKey(siteId) });
    void queryClient.invalidateQueries({ queryKey: getMyDocumentsQueryKey() });
  }, [build.status, build.id, queryClient, siteId]);

  return (
    <section
      aria-labelledby="build-progress-heading"
      className="grid gap-3 rounded-lg border border-hairline bg-white p-4 md:p-5"
    >
      <h3 id="build-progress-heading" className="text-lg font-semibold">
        Issuing the pack
      </h3>
      {build.status === 'failed' ? null : (
        <ProgressBar
          label="Issuing the handover pack"
          percent={build.status === 'done' ? 100 : build.percent}
          valueText={BUILD_STAGE_LABELS[build.stage]}
        />
      )}
      <p role="status" className="font-medium">
        {buildMessage(build)}
      </p>
      {pollError && build.status !== 'done' && build.status !== 'failed' ? (
        <ProblemAlert
          error={pollError}
          hint="Wardbook could not ask how the pack is getting on; it keeps trying. The pack is still being built on the server."
        />
      ) : null}
      {build.status === 'done' && build.packNumber ? (
        <Notice tone="normal" icon={ShieldCheck} title={`Pack ${build.packNumber} is issued`}>
          <p>
            It is numbered, sealed and stored, and the homeowner has been sent a copy. Corrections
            from now on are issued as a new revision.
          </p>
          <div className="mt-3 flex flex-wrap gap-2">
            <a
              href={packPdfUrl(build.packNumber)}
              download
              className={buttonClassName({ size: 'lg' })}
            >
              <Download aria-hidden="true" className="size-5" />
              Download pack {build.packNumber}
            </a>
            <Link
              to={paths.verify.pack.getHref(build.packNumber)}
              className={buttonClassName({ variant: 'secondary', size: 'lg' })}
            >
              <ShieldCheck aria-hidden="true" className="size-5" />
              Verification page for {build.packNumber}
            </Link>
          </div>
        </Notice>
      ) : null}
      {build.status === 'failed' ? (
        <div role="alert">
          <Notice tone="alarm" title="The pack was not issued">
            <p>{build.error ?? 'The build stopped before it finished.'}</p>
            <p className="mt-1">
              Nothing was numbered, sealed or sent. Put the problem right, then issue the pack
              again.
            </p>
          </Notice>
        </div>
      ) : null}
    </section>
  );
}
