import { CircleCheck, ClipboardCheck, OctagonAlert, PencilLine } from 'lucide-react';
import { Link } from 'react-router-dom';

import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

type PreIssueStatusProps = {
  /** The pre-issue check's blocking problems, in plain words from the API. */
  blocking: readonly string[];
  commissioningHref: string;
  /** Starts a variation with the problem's words, for the engineer to finish. */
  onWriteAsVariation: (problem: string) => void;
};

/** What the pre-issue check still finds wrong, and the two ways past each problem. */
export function PreIssueStatus({
  blocking,
  commissioningHref,
  onWriteAsVariation,
}: PreIssueStatusProps) {
  return (
    <section aria-labelledby="handover-check-heading" className="grid gap-4">
      <h2 id="handover-check-heading" className="flex items-center gap-2 text-xl font-semibold">
        <ClipboardCheck aria-hidden="true" className="size-6 shrink-0" />
        Pre-issue check
      </h2>
      {blocking.length === 0 ? (
        <Notice tone="normal" icon={CircleCheck} title="Nothing blocks the pack">
          <p>Every zone and system test the pack needs is recorded and passed.</p>
        </Notice>
      ) : (
        <>
          <Notice
            tone="alarm"
            icon={OctagonAlert}
            title={
              blocking.length === 1
                ? '1 problem blocks the pack'
                : `${blocking.length} problems block the pack`
            }
          >
            <p>
              Put each one right and record it on the commissioning page, or write it down below as
              a variation: a departure from the design that the customer accepts by signing.
            </p>
          </Notice>
          <ul
            aria-label="Problems that block the pack"
            className="divide-y divide-hairline rounded-lg border border-hairline bg-white"
          >
            {blocking.map((problem, index) => (
              <li key={`${index}-${problem}`} className="grid gap-2 px-3 py-3 md:px-4">
                <p className="inline-flex items-center gap-1.5 text-sm font-semibold text-alarm">
                  <OctagonAlert aria-hidden="true" className="size-4 shrink-0" />
                  Blocking
                </p>
                <p>{problem}</p>
                <div>
                  <Button
                    variant="secondary"
                    size="lg"
                    aria-label={`Write down as a variation: ${problem}`}
                    onClick={() => onWriteAsVariation(problem)}
                  >
                    <PencilLine aria-hidden="true" className="size-5" />
                    Write down as a variation
                  </Button>
                </div>
              </li>
            ))}
          </ul>
          <p>
            <Link
              to={commissioningHref}
              className="inline-flex min-h-11 items-center font-semibold"
            >
              Go to the commissioning page
            </Link>
          </p>
        </>
      )}
    </section>
  );
}
