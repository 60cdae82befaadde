import type { FieldValues, Path, UseFormSetError } from 'react-hook-form';

import { ApiError } from '@/lib/api-client';

/** True when the API refused a save because someone else changed the record first. */
export function isStaleEdit(error: unknown): boolean {
  return error instanceof ApiError && error.status === 409;
}

/**
 * Puts the API's field errors beside the form's fields. Problem paths name the request part first
 * (`body.zones.3.number`); the form knows only the field path (`zones.3.number`).
 *
 * Returns the messages that belong to no single field the form shows, for a summary at the top.
 */
export function applyServerFieldErrors<Values extends FieldValues>(
  error: unknown,
  setError: UseFormSetError<Values>,
  isShownField: (fieldPath: string) => boolean = () => true,
): string[] {
  if (!(error instanceof ApiError)) return [];
  const unplaced: string[] = [];
  for (const { path, message } of error.fieldErrors) {
    const fieldPath = path.startsWith('body.') ? path.slice('body.'.length) : '';
    if (fieldPath && isShownField(fieldPath)) {
      setError(fieldPath as Path<Values>, { type: 'server', message });
    } else {
      unplaced.push(message);
    }
  }
  return unplaced;
}

/**
 * An `isShownField` for forms whose fields sit at the top level: an API error path is shown
 * beside its field when it starts with one of `fieldNames` ("unavailable.0.to" → "unavailable").
 */
export function isUnderFields(fieldNames: readonly string[]): (fieldPath: string) => boolean {
  return (fieldPath) => fieldNames.includes(fieldPath.split('.')[0] ?? '');
}

type ErrorTree = { message?: unknown; type?: unknown } | readonly unknown[] | undefined;

/** Counts the field errors in a react-hook-form errors object, however deeply nested. */
export function countFieldErrors(errors: unknown): number {
  if (!errors || typeof errors !== 'object') return 0;
  const tree = errors as ErrorTree;
  if (!Array.isArray(tree) && typeof (tree as { message?: unknown }).message === 'string') {
    return 1;
  }
  return Object.entries(errors).reduce(
    // `ref` points back at the DOM element, not at more errors.
    (total, [key, value]) => (key === 'ref' ? total : total + countFieldErrors(value)),
    0,
  );
}
