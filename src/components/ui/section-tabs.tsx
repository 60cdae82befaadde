import { NavLink } from 'react-router-dom';

import { cn } from '@/utils/cn';

export type SectionTab = {
  label: string;
  href: string;
  /** Shown as a badge; `countLabel` says it in words for screen readers ("8 zones"). */
  count?: number;
  countLabel?: string;
  /** Only an exact match marks this tab current (for the section at the parent's own URL). */
  end?: boolean;
};

type SectionTabsProps = { label: string; tabs: readonly SectionTab[] };

/**
 * Links between the sections of one record, styled as tabs. They are real links, so each section
 * has its own URL and the browser's back button works; the current one carries aria-current.
 */
export function SectionTabs({ label, tabs }: SectionTabsProps) {
  return (
    <nav aria-label={label} className="relative -mx-4 overflow-x-auto px-4 md:mx-0 md:px-0">
      <ul className="flex min-w-max gap-1 border-b border-hairline">
        {tabs.map((tab) => (
          <li key={tab.href}>
            <NavLink
              to={tab.href}
              end={tab.end}
              className={({ isActive }) =>
                cn(
                  '-mb-px flex min-h-11 items-center gap-2 border-b-4 px-3 text-sm font-semibold no-underline',
                  isActive
                    ? 'border-brass text-ink'
                    : 'border-transparent text-ink-muted hover:border-hairline hover:text-ink',
                )
              }
            >
              {tab.label}
              {tab.count === undefined ? null : (
                <>
                  <span
                    aria-hidden="true"
                    className="rounded-full bg-paper-deep px-2 py-0.5 font-mono text-xs text-ink"
                  >
                    {tab.count}
                  </span>
                  <span className="sr-only">({tab.countLabel ?? tab.count})</span>
                </>
              )}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
