import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';

import type { NavigationItem } from '@/components/layouts/navigation';
import { SkipLink } from '@/components/ui/skip-link';
import { WordmarkLink } from '@/components/ui/wordmark';
import { cn } from '@/utils/cn';

type WideLayoutProps = {
  homeHref: string;
  /** The signed-in person's controls: role switcher, name, sign out. */
  account: ReactNode;
  /** Who and where the person is working as, shown above the navigation. */
  context?: ReactNode;
  navigation: readonly NavigationItem[];
  children: ReactNode;
};

/** For people at a desk (engineers, office, operators): left navigation and room for tables. */
export function WideLayout({ homeHref, account, context, navigation, children }: WideLayoutProps) {
  return (
    <div className="flex min-h-dvh flex-col">
      <SkipLink />
      <header className="surface-ink bg-ink text-paper">
        <div className="flex flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2 md:px-6">
          <WordmarkLink to={homeHref} />
          <div className="ml-auto">{account}</div>
        </div>
      </header>
      <div className="flex flex-1 flex-col md:flex-row">
        <nav
          aria-label="Main"
          className="shrink-0 border-b border-hairline bg-white md:w-60 md:border-r md:border-b-0"
        >
          {context ? (
            <div className="border-b border-hairline px-4 py-3 text-sm">{context}</div>
          ) : null}
          <ul className="flex gap-1 overflow-x-auto p-2 md:flex-col">
            {navigation.map((item) => (
              <li key={item.href}>
                <NavLink
                  to={item.href}
                  end={item.exact ?? true}
                  className={({ isActive }) =>
                    cn(
                      'flex min-h-10 items-center gap-3 rounded-md border-l-4 px-3 text-sm font-medium no-underline',
                      isActive
                        ? 'border-brass bg-paper-deep text-ink'
                        : 'border-transparent text-ink-muted hover:bg-paper hover:text-ink',
                    )
                  }
                >
                  <item.icon aria-hidden="true" className="size-4 shrink-0" />
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
        <main id="main" tabIndex={-1} className="min-w-0 flex-1 focus:outline-none">
          <div className="mx-auto max-w-6xl px-4 py-6 md:px-8 md:py-8">{children}</div>
        </main>
      </div>
    </div>
  );
}
