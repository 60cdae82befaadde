import { useId, type ReactNode } from 'react';
import { ShieldAlert } from 'lucide-react';

import { cn } from '@/utils/cn';

export type SafetyPoint = { id: string; lead: string; text: ReactNode };

type SafetyCardProps = {
  title: string;
  points: readonly SafetyPoint[];
  footnote: ReactNode;
  /** Larger type, for pages where the caution is the main thing to read. */
  prominent?: boolean;
  className?: string;
};

/**
 * Cautions sit under an ink band rather than a state colour: they are advice, not the state of a
 * system, and alarm/fault colours are kept for states.
 */
export function SafetyCard({
  title,
  points,
  footnote,
  prominent = false,
  className,
}: SafetyCardProps) {
  const headingId = useId();
  return (
    <section
      aria-labelledby={headingId}
      className={cn('overflow-hidden rounded-lg border border-ink bg-white', className)}
    >
      <div className="surface-ink flex items-start gap-3 bg-ink px-4 py-3 text-paper md:px-5">
        <ShieldAlert
          aria-hidden="true"
          className={cn('mt-0.5 shrink-0 text-brass-light', prominent ? 'size-7' : 'size-5')}
        />
        <div>
          <p className="text-xs font-semibold tracking-wider text-brass-light uppercase">Safety</p>
          <h2
            id={headingId}
            className={cn('font-semibold text-paper', prominent ? 'text-xl' : 'text-base')}
          >
            {title}
          </h2>
        </div>
      </div>
      <ul className={cn('divide-y divide-hairline', prominent ? 'text-base' : 'text-sm')}>
        {points.map((point) => (
          <li key={point.id} className="px-4 py-3 md:px-5">
            <span className="font-semibold">{point.lead}</span> {point.text}
          </li>
        ))}
      </ul>
      <p className="border-t border-hairline bg-paper px-4 py-3 text-sm text-ink-muted md:px-5">
        {footnote}
      </p>
    </section>
  );
}
