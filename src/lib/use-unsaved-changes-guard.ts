import { useEffect } from 'react';
import { useBlocker } from 'react-router-dom';

const leaveQuestion = 'You have changes that are not saved. Leave this page and lose them?';

/**
 * Asks before leaving a form with unsaved changes, both for links inside Wardbook and for
 * closing or reloading the tab. A schedule typed on site is too much work to lose to a misclick.
 * Pass false while a save is on its way: that save still completes after the page changes.
 */
export function useUnsavedChangesGuard(hasUnsavedChanges: boolean) {
  const blocker = useBlocker(
    ({ currentLocation, nextLocation }) =>
      hasUnsavedChanges && currentLocation.pathname !== nextLocation.pathname,
  );

  useEffect(() => {
    if (blocker.state !== 'blocked') return;
    // The browser's own dialog: focus, keyboard and screen readers all work without extra code.
    if (window.confirm(leaveQuestion)) blocker.proceed();
    else blocker.reset();
  }, [blocker]);

  useEffect(() => {
    if (!hasUnsavedChanges) return;
    const warnBeforeUnload = (event: BeforeUnloadEvent) => event.preventDefault();
    window.addEventListener('beforeunload', warnBeforeUnload);
    return () => window.removeEventListener('beforeunload', warnBeforeUnload);
  }, [hasUnsavedChanges]);
}
