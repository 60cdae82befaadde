import type { ReactNode } from 'react';

type SectionAfterCautionsProps = {
  /** Safety cards for the work the section records. */
  cautions: ReactNode;
  headingId: string;
  title: string;
  description: string;
  children: ReactNode;
};

/**
 * A record section whose work means ladders, drills or open panels. The cautions come first in
 * reading order: they are for before the ladder and the drill.
 */
export function SectionAfterCautions({
  cautions,
  headingId,
  title,
  description,
  children,
}: SectionAfterCautionsProps) {
  return (
    <>
      <div className="mb-6 grid gap-6 lg:grid-cols-2">{cautions}</div>
      <section aria-labelledby={headingId} className="grid gap-6">
        <div>
          <h2 id={headingId} className="text-xl font-semibold">
            {title}
          </h2>
          <p className="max-w-prose text-sm text-ink-muted">{description}</p>
        </div>
        {children}
      </section>
    </>
  );
}
