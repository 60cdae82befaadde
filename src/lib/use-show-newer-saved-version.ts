import { useEffect } from 'react';
import type { FieldValues, Path, UseFormReturn } from 'react-hook-form';

type UseShowNewerSavedVersionOptions<Values extends FieldValues, Output, Saved, Version> = {
  form: UseFormReturn<Values, unknown, Output>;
  /** The form field holding the version the person is editing. */
  versionField: Path<Values>;
  /** The record as the query cache has it now, and its version. */
  saved: Saved;
  savedVersion: Version;
  /** Must not change from render to render (a module-level function), or the check runs each time. */
  toFormValues: (saved: Saved, version: Version) => Values;
};

/**
 * Someone else's save reached the cache (another tab, a refetch): the form shows it, unless it
 * holds typing that would be lost. A form with changes keeps them and meets the newer version
 * when it saves, as a conflict it can reload from.
 */
export function useShowNewerSavedVersion<Values extends FieldValues, Output, Saved, Version>({
  form,
  versionField,
  saved,
  savedVersion,
  toFormValues,
}: UseShowNewerSavedVersionOptions<Values, Output, Saved, Version>) {
  const { isDirty } = form.formState;
  useEffect(() => {
    if (!isDirty && form.getValues(versionField) !== savedVersion) {
      form.reset(toFormValues(saved, savedVersion));
    }
  }, [form, versionField, isDirty, saved, savedVersion, toFormValues]);
}
