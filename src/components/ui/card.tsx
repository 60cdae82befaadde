import { useId, type ReactNode } from 'react';
import type { LucideIcon } from 'lucide-react';

import { cn } from '@/utils/cn';

type CardProps = {
  title: string;
  headingLevel?: 2 | 3;
  icon?: LucideIcon;
  /** Drop the body padding, for tables that run edge to edge. */
  flush?: boolean;
  className?: string;
  children: ReactNode;
};

/** A white card with a hairline border, labelled by its own heading. */
export function Card({
  title,
  headingLevel = 2,
  icon: Icon,
  flush = false,
  className,
  children,
}: CardProps) {
  const headingId = useId();
  const Heading = headingLevel === 2 ? 'h2' : 'h3';
  return (
    <section
      aria-labelledby={headingId}
      className={cn('overflow-hidden rounded-lg border border-hairline bg-white', className)}
    >
      <div className="flex items-center gap-2 border-b border-hairline px-4 py-3 md:px-5">
        {Icon ? <Icon aria-hidden="true" className="size-5 shrink-0 text-ink" /> : null}
        <Heading id={headingId} className="text-base font-semibold">
          {title}
        </Heading>
      </div>
      <div className={flush ? undefined : 'px-4 py-4 md:px-5'}>{children}</div>
    </section>
  );
}
