import { ApiError } from '@/lib/api-client';

/** Field errors by the body path they belong to ("battery.restingVolts", "zones.2.secureReading"). */
export type FieldErrors = Record<string, string>;

/** Problems from the form's own check (zod issues) or the API's reply, keyed by body path. */
export function errorsFromIssues(issues: readonly { path: PropertyKey[]; message: string }[]) {
  const errors: FieldErrors = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join('.');
    errors[key] ??= issue.message;
  }
  return errors;
}

export function errorsFromApi(error: unknown): FieldErrors {
  if (!(error instanceof ApiError)) return {};
  return errorsFromIssues(
    error.fieldErrors.map(({ path, message }) => ({
      path: path.startsWith('body.') ? path.slice('body.'.length).split('.') : [path],
      message,
    })),
  );
}
