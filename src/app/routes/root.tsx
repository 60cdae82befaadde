import { useEffect, useRef } from 'react';
import { Outlet, ScrollRestoration, useLocation, useNavigation } from 'react-router-dom';

import { cn } from '@/utils/cn';

/**
 * After an in-app navigation, focus moves to the new page's h1 so keyboard and screen-reader
 * users start at its title, as they would after a full page load.
 */
function useFocusHeadingOnNavigation() {
  const { pathname } = useLocation();
  const previousPathname = useRef(pathname);

  useEffect(() => {
    if (previousPathname.current === pathname) return;
    previousPathname.current = pathname;
    document.querySelector<HTMLElement>('main h1')?.focus({ preventScroll: true });
  }, [pathname]);
}

export function RootRoute() {
  const navigation = useNavigation();
  const isNavigating = navigation.state !== 'idle';
  useFocusHeadingOnNavigation();

  return (
    <>
      <div
        aria-hidden="true"
        className={cn(
          'pointer-events-none fixed inset-x-0 top-0 z-50 h-1 overflow-hidden',
          !isNavigating && 'hidden',
        )}
      >
        <div className="h-full w-2/5 animate-progress bg-brass" />
      </div>
      <p role="status" className="sr-only">
        {isNavigating ? 'Loading page…' : ''}
      </p>
      <Outlet />
      <ScrollRestoration />
    </>
  );
}
