import type { MouseEvent } from 'react';

type SkipLinkProps = { targetId?: string };

export function SkipLink({ targetId = 'main' }: SkipLinkProps) {
  // Moving focus by hand keeps "#main" out of the address bar and the router's history.
  const skipToTarget = (event: MouseEvent<HTMLAnchorElement>) => {
    const target = document.getElementById(targetId);
    if (!target) return;
    event.preventDefault();
    target.focus();
    target.scrollIntoView();
  };

  return (
    <a
      href={`#${targetId}`}
      onClick={skipToTarget}
      className="sr-only focus:not-sr-only focus:fixed focus:top-3 focus:left-3 focus:z-50 focus:rounded-md focus:border focus:border-ink focus:bg-white focus:px-4 focus:py-3 focus:font-semibold focus:text-ink"
    >
      Skip to main content
    </a>
  );
}
