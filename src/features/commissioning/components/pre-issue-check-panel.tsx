import { CircleCheck, ClipboardCheck, Info, OctagonAlert } from 'lucide-react';

import type { PreIssueCheck, PreIssueProblem } from '@server/commissioning/schema';
import { Notice } from '@/components/ui/notice';

type PreIssueCheckPanelProps = {
  check: PreIssueCheck;
  zoneNumbers: ReadonlyMap<string, number>;
  /** Records waiting on the phone: the check counts only what the API has. */
  waitingCount: number;
  onOpenZone: (zoneId: string) => void;
};

const SEVERITY = {
  blocking: { icon: OctagonAlert, words: 'Blocking', colour: 'text-alarm' },
  advice: { icon: Info, words: 'Advice', colour: 'text-info' },
} as const;

function ProblemItem({
  problem,
  zoneNumber,
  onOpenZone,
}: {
  problem: PreIssueProblem;
  zoneNumber: number | undefined;
  onOpenZone: (zoneId: string) => void;
}) {
  const severity = SEVERITY[problem.severity];
  const { zoneId } = problem;
  return (
    <li className="grid gap-1 px-3 py-3 md:px-4">
      <p className={`inline-flex items-center gap-1.5 text-sm font-semibold ${severity.colour}`}>
        <severity.icon aria-hidden="true" className="size-4 shrink-0" />
        {severity.words}
      </p>
      <p>{problem.message}</p>
      {zoneId && zoneNumber !== undefined ? (
        <a
          href={`?zone=${encodeURIComponent(zoneId)}`}
          className="inline-flex min-h-11 w-fit items-center font-semibold text-ink"
          onClick={(event) => {
            event.preventDefault();
            onOpenZone(zoneId);
          }}
        >
          Go to zone {zoneNumber}
        </a>
      ) : null}
    </li>
  );
}

/**
 * Everything that stands between this system and its handover pack, in plain words from the
 * API: blocking problems first, then advice, each linked to its zone where it has one.
 */
export function PreIssueCheckPanel({
  check,
  zoneNumbers,
  waitingCount,
  onOpenZone,
}: PreIssueCheckPanelProps) {
  const blocking = check.problems.filter((problem) => problem.severity === 'blocking');
  const advice = check.problems.filter((problem) => problem.severity === 'advice');
  return (
    <section
      id="pre-issue-check"
      aria-labelledby="pre-issue-check-heading"
      className="grid scroll-mt-4 gap-4"
    >
      <h2 id="pre-issue-check-heading" className="flex items-center gap-2 text-xl font-semibold">
        <ClipboardCheck aria-hidden="true" className="size-6 shrink-0" />
        Pre-issue check
      </h2>
      {check.clear ? (
        <Notice tone="normal" icon={CircleCheck} title="Ready to issue">
          <p>
            Nothing blocks the handover pack.
            {advice.length > 0 ? ' The advice below is worth a look first.' : ''}
          </p>
        </Notice>
      ) : (
        <Notice tone="alarm" icon={OctagonAlert} title="Cannot be issued yet">
          <p>
            {blocking.length === 1
              ? '1 blocking problem must be put right'
              : `${blocking.length} blocking problems must be put right`}{' '}
            before the handover pack can be issued.
          </p>
        </Notice>
      )}
      {waitingCount > 0 ? (
        <p className="text-sm text-ink-muted">
          {waitingCount === 1 ? '1 record is' : `${waitingCount} records are`} still on this phone;
          the check will count {waitingCount === 1 ? 'it' : 'them'} once sent.
        </p>
      ) : null}
      {check.problems.length > 0 ? (
        <ul
          aria-label="Problems found"
          className="divide-y divide-hairline rounded-lg border border-hairline bg-white"
        >
          {[...blocking, ...advice].map((problem, index) => (
            <ProblemItem
              key={`${problem.code}-${problem.zoneId ?? ''}-${index}`}
              problem={problem}
              zoneNumber={problem.zoneId ? zoneNumbers.get(problem.zoneId) : undefined}
              onOpenZone={onOpenZone}
            />
          ))}
        </ul>
      ) : null}
    </section>
  );
}
