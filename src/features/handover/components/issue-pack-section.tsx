import { useId, useState } from 'react';
import { CircleCheck, CircleDashed, FileCheck2 } from 'lucide-react';

import type { HandoverState, PackBuild } from '@server/handover/schema';
import { Button } from '@/components/ui/button';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { isFinished, usePackBuild } from '@/features/handover/api/get-pack-build';
import { useIssuePack } from '@/features/handover/api/issue-pack';
import { BuildProgress } from '@/features/handover/components/build-progress';

type IssuePackSectionProps = {
  siteId: string;
  state: HandoverState;
  /** Only an engineer of the installer issues the pack. */
  canIssueAsEngineer: boolean;
};

const ENGINEERS_ISSUE = 'Only one of the company’s engineers can issue the pack.';

/** What is still missing, the Issue button, and the build once it has started. */
export function IssuePackSection({ siteId, state, canIssueAsEngineer }: IssuePackSectionProps) {
  const reasonsId = useId();
  const { draft } = state;
  const canIssue = state.canIssue && canIssueAsEngineer;
  const waitingFor = canIssueAsEngineer ? state.waitingFor : [...state.waitingFor, ENGINEERS_ISSUE];
  // The build this page started; otherwise one the draft has under way or that failed (a
  // finished one is already in the list of issued packs).
  const [startedBuild, setStartedBuild] = useState<PackBuild | null>(null);
  const draftBuild = draft.build && draft.build.status !== 'done' ? draft.build : null;
  const { build, error: pollError } = usePackBuild(startedBuild ?? draftBuild);
  const issuePack = useIssuePack({ onSuccess: setStartedBuild });
  const isBuilding = issuePack.isPending || (build !== null && !isFinished(build));
  // One issue per visit: once this page has issued a pack, the next is a new revision, issued
  // after the record is corrected and signed again.
  const canPress = canIssue && !isBuilding && build?.status !== 'done';

  return (
    <section aria-labelledby="issue-heading" className="grid gap-4">
      <h2 id="issue-heading" className="flex items-center gap-2 text-xl font-semibold">
        <FileCheck2 aria-hidden="true" className="size-6 shrink-0" />
        Issue the pack
      </h2>
      <div className="grid gap-2">
        <h3 className="font-semibold">Before the pack can be issued</h3>
        {waitingFor.length === 0 ? (
          <p className="flex items-start gap-2">
            <CircleCheck aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-normal" />
            Everything is in place.
          </p>
        ) : (
          <ul id={reasonsId} aria-label="Still needed" className="grid gap-2">
            {waitingFor.map((reason) => (
              <li key={reason} className="flex items-start gap-2">
                <CircleDashed aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-info" />
                <span>
                  <span className="sr-only">Still needed: </span>
                  {reason}
                </span>
              </li>
            ))}
          </ul>
        )}
      </div>
      <p className="max-w-prose text-sm text-ink-muted">
        Issuing numbers the pack, seals it, stores it and e-mails it to the homeowner. An issued
        pack is never edited: a correction is issued as a new revision that supersedes it.
      </p>
      <div>
        <Button
          size="lg"
          aria-disabled={!canPress}
          aria-describedby={waitingFor.length > 0 ? reasonsId : undefined}
          className={canPress ? undefined : 'cursor-not-allowed opacity-70'}
          onClick={() => {
            if (canPress) issuePack.mutate({ siteId });
          }}
        >
          <FileCheck2 aria-hidden="true" className="size-5" />
          {isBuilding ? 'Issuing…' : 'Issue the handover pack'}
        </Button>
      </div>
      {issuePack.isError ? <ProblemAlert error={issuePack.error} /> : null}
      {build ? <BuildProgress siteId={siteId} build={build} pollError={pollError} /> : null}
    </section>
  );
}
