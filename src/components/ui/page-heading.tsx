import type { ReactNode } from 'react';

type PageHeadingProps = { title: string; children?: ReactNode };

/**
 * The page's only h1. It can take focus so that, after an in-app navigation, screen-reader and
 * keyboard users start reading from the new page's title.
 */
export function PageHeading({ title, children }: PageHeadingProps) {
  return (
    <div className="mb-6">
      <h1 tabIndex={-1} className="text-2xl font-semibold tracking-tight md:text-3xl">
        {title}
      </h1>
      {children ? <div className="mt-2 max-w-prose text-ink-muted">{children}</div> : null}
    </div>
  );
}
