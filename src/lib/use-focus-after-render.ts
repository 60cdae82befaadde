import { useCallback, useEffect, useRef } from 'react';

/**
 * Moves keyboard focus to an element once React has drawn the change that put it there: after a
 * row is moved, added or removed, the person carries on from the same control instead of being
 * dropped at the top of the page.
 */
export function useFocusAfterRender() {
  const pendingIds = useRef<string[] | null>(null);

  useEffect(() => {
    const candidates = pendingIds.current;
    if (!candidates) return;
    pendingIds.current = null;
    for (const id of candidates) {
      const element = document.getElementById(id);
      if (element && !(element as HTMLButtonElement).disabled) {
        element.focus();
        return;
      }
    }
  });

  /** Focus the first of these element ids that exists and is enabled after the next render. */
  return useCallback((...elementIds: string[]) => {
    pendingIds.current = elementIds;
  }, []);
}
