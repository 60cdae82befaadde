import { useState } from 'react';

const storageKey = (visitId: string) => `wardbook.visit-completion-key.${visitId}`;

/**
 * The key this phone sends with a visit's completed form. It is kept on the device, so a resend
 * after a dropped connection or a reload carries the same key and the visit is recorded once.
 */
export function useCompletionKey(visitId: string): string {
  const [key] = useState(() => {
    try {
      const kept = window.localStorage.getItem(storageKey(visitId));
      if (kept) return kept;
      const made = crypto.randomUUID();
      window.localStorage.setItem(storageKey(visitId), made);
      return made;
    } catch {
      // Storage refused (private browsing): the key still holds for resends from this screen.
      return crypto.randomUUID();
    }
  });
  return key;
}

/** Once the visit is recorded, the key has done its job. */
export function forgetCompletionKey(visitId: string): void {
  try {
    window.localStorage.removeItem(storageKey(visitId));
  } catch {
    // Nothing kept, nothing to forget.
  }
}
