/*
 * Converters for react-hook-form's `setValueAs`: inputs hold strings, while the shared zod
 * schemas expect numbers and nulls. Empty means "not recorded" (null) for optional fields and
 * "not chosen" (undefined, so the schema asks for it) for required ones.
 */

export function numberOrNull(value: unknown): number | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number') return value;
  const text = String(value).trim();
  return text === '' ? null : Number(text);
}

export function numberOrUndefined(value: unknown): number | undefined {
  return numberOrNull(value) ?? undefined;
}

export function textOrNull(value: unknown): string | null {
  if (value === null || value === undefined) return null;
  const text = String(value);
  return text.trim() === '' ? null : text;
}
