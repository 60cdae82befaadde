import { useCallback, useEffect } from 'react';
import type { FieldValues, UseFormReturn } from 'react-hook-form';

/*
 * What has been typed into a commissioning form but not saved yet, kept in localStorage so a
 * reload, a dropped tab or a flat phone does not lose a reading taken up a ladder.
 */

const DRAFT_PREFIX = 'wardbook:commissioning-draft:';
/**
 * Drafts are kept per signed-in person and site (`draftScope` is "<user id>:<site id>"), so on a
 * shared phone nobody is handed someone else's half-typed readings.
 */
const draftKey = (draftScope: string, formName: string) =>
  `${DRAFT_PREFIX}${draftScope}:${formName}`;

/** The saved draft merged over the form's blank values, or the blank values alone. */
export function withDraft<Values extends FieldValues>(
  draftScope: string,
  formName: string,
  blank: Values,
): Values {
  try {
    const stored = window.localStorage.getItem(draftKey(draftScope, formName));
    if (!stored) return blank;
    const draft: unknown = JSON.parse(stored);
    if (!draft || typeof draft !== 'object') return blank;
    // Only the fields the form has, with the types it expects.
    const merged = { ...blank };
    for (const [name, value] of Object.entries(draft)) {
      if (name in blank && typeof value === typeof blank[name]) {
        (merged as Record<string, unknown>)[name] =
          typeof value === 'object' && value !== null ? { ...blank[name], ...value } : value;
      }
    }
    return merged;
  } catch {
    return blank;
  }
}

/** True while a draft is kept for this form. */
export function hasDraft(draftScope: string, formName: string): boolean {
  try {
    return window.localStorage.getItem(draftKey(draftScope, formName)) !== null;
  } catch {
    return false;
  }
}

/**
 * Keeps the form's values as a draft whenever the person changes them; `clearDraft` drops it
 * once the record is saved or kept in the outbox.
 */
export function useDraft<Values extends FieldValues>(
  form: UseFormReturn<Values>,
  draftScope: string,
  formName: string,
) {
  const key = draftKey(draftScope, formName);
  useEffect(() => {
    const subscription = form.watch((values, { type }) => {
      // Only the person's own changes: a reset after saving must not bring the draft back.
      if (type !== 'change') return;
      try {
        window.localStorage.setItem(key, JSON.stringify(values));
      } catch {
        // Storage full or switched off: the values stay on screen, just not across a reload.
      }
    });
    return () => subscription.unsubscribe();
  }, [form, key]);

  return useCallback(() => {
    try {
      window.localStorage.removeItem(key);
    } catch {
      // Nothing kept, nothing to clear.
    }
  }, [key]);
}
