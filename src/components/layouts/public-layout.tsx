import type { ReactNode } from 'react';

import { SkipLink } from '@/components/ui/skip-link';
import { WordmarkLink } from '@/components/ui/wordmark';
import { paths } from '@/config/paths';

type PublicLayoutProps = {
  /** Shown at the right of the header, e.g. a sign-out button on a signed-in error page. */
  headerAside?: ReactNode;
  children: ReactNode;
};

/** The frame for pages outside a role: the landing page, sign-in problems, not-found. */
export function PublicLayout({ headerAside, children }: PublicLayoutProps) {
  return (
    <div className="flex min-h-dvh flex-col">
      <SkipLink />
      <header className="surface-ink bg-ink text-paper">
        <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-4 px-4 py-2 md:px-6">
          <WordmarkLink to={paths.landing.getHref()} />
          {headerAside ? <div className="ml-auto">{headerAside}</div> : null}
        </div>
      </header>
      <main id="main" tabIndex={-1} className="flex-1 focus:outline-none">
        {children}
      </main>
      <footer className="border-t border-hairline bg-white">
        <p className="mx-auto max-w-6xl px-4 py-5 text-sm text-ink-muted md:px-6">
          Wardbook: the book of record for intruder-alarm systems and the people around them.
        </p>
      </footer>
    </div>
  );
}
