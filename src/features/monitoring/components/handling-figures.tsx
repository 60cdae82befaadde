import { Timer } from 'lucide-react';

import {
  useHandlingFigures,
  type PeriodFigures,
} from '@/features/monitoring/api/get-handling-figures';
import { formatDuration } from '@/utils/elapsed';

const duration = (seconds: number | null) => (seconds === null ? '–' : formatDuration(seconds));

function Period({ title, figures }: { title: string; figures: PeriodFigures }) {
  const items = [
    { term: 'Events', value: String(figures.events) },
    { term: 'Closed', value: String(figures.closed) },
    { term: 'Median time to take', value: duration(figures.medianSecondsToTake) },
    { term: '90th percentile to take', value: duration(figures.p90SecondsToTake) },
    { term: 'Median time to close', value: duration(figures.medianSecondsToClose) },
  ];
  return (
    <div className="min-w-0">
      <h3 className="text-sm font-semibold">{title}</h3>
      <dl className="mt-1 flex flex-wrap gap-x-6 gap-y-1 text-sm">
        {items.map((item) => (
          <div key={item.term} className="flex gap-1.5">
            <dt className="text-ink-muted">{item.term}</dt>
            <dd className="font-mono font-semibold">{item.value}</dd>
          </div>
        ))}
      </dl>
    </div>
  );
}

/** How quickly the centre has been taking and closing events: a strip above the queue. */
export function HandlingFigures() {
  const { data: figures, isPending, isError } = useHandlingFigures();
  return (
    <section
      aria-labelledby="handling-figures-heading"
      className="rounded-lg border border-hairline bg-white px-4 py-3 md:px-5"
    >
      <h2 id="handling-figures-heading" className="flex items-center gap-2 text-base font-semibold">
        <Timer aria-hidden="true" className="size-5 shrink-0" />
        Handling times
      </h2>
      {isPending ? (
        <p className="mt-1 text-sm text-ink-muted">Loading the figures…</p>
      ) : isError ? (
        <p className="mt-1 text-sm text-ink-muted">
          The handling figures could not be loaded just now; the queue is unaffected.
        </p>
      ) : (
        <div className="mt-2 grid gap-3 lg:grid-cols-2">
          <Period title="Last 24 hours" figures={figures.last24Hours} />
          <Period title="Last 7 days" figures={figures.last7Days} />
        </div>
      )}
    </section>
  );
}
