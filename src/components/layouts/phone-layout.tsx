import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';

import type { NavigationItem } from '@/components/layouts/navigation';
import { SkipLink } from '@/components/ui/skip-link';
import { WordmarkLink } from '@/components/ui/wordmark';
import { cn } from '@/utils/cn';

type PhoneLayoutProps = {
  homeHref: string;
  /** Beside the wordmark, e.g. sign-out. */
  headerAction: ReactNode;
  /** A second header row with the person's name and role switcher. */
  account: ReactNode;
  navigation: readonly NavigationItem[];
  children: ReactNode;
};

/** For homeowners and keyholders, mostly on phones: one column and 44px targets throughout. */
export function PhoneLayout({
  homeHref,
  headerAction,
  account,
  navigation,
  children,
}: PhoneLayoutProps) {
  return (
    <div className="flex min-h-dvh flex-col">
      <SkipLink />
      <header className="surface-ink bg-ink text-paper">
        <div className="mx-auto max-w-2xl px-4 py-2">
          <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
            <WordmarkLink to={homeHref} />
            <div className="ml-auto">{headerAction}</div>
          </div>
          <div className="mt-2 border-t border-paper/20 pt-2">{account}</div>
        </div>
      </header>
      <nav aria-label="Main" className="border-b border-hairline bg-white">
        <ul className="mx-auto flex max-w-2xl gap-2 overflow-x-auto px-4">
          {navigation.map((item) => (
            <li key={item.href}>
              <NavLink
                to={item.href}
                end={item.exact ?? true}
                className={({ isActive }) =>
                  cn(
                    'flex min-h-12 items-center gap-2 border-b-4 px-2 text-base font-medium no-underline',
                    isActive
                      ? 'border-brass text-ink'
                      : 'border-transparent text-ink-muted hover:text-ink',
                  )
                }
              >
                <item.icon aria-hidden="true" className="size-5 shrink-0" />
                {item.label}
              </NavLink>
            </li>
          ))}
        </ul>
      </nav>
      <main id="main" tabIndex={-1} className="flex-1 focus:outline-none">
        <div className="mx-auto w-full max-w-2xl px-4 py-6">{children}</div>
      </main>
    </div>
  );
}
