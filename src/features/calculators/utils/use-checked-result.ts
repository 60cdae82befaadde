import { useState } from 'react';
import type { FieldValues, UseFormReturn } from 'react-hook-form';

import { applyServerFieldErrors } from '@/lib/form-errors';

/**
 * The API's answer for a calculator, kept with the figures it was for: once the figures change
 * it no longer applies, and the live preview takes its place again. Refusals put the API's
 * field errors beside the fields; what no field shows is returned for a summary.
 */
export function useCheckedResult<Query, Result, Values extends FieldValues>(
  form: UseFormReturn<Values>,
) {
  const [checked, setChecked] = useState<{ key: string; result: Result } | null>(null);
  const [unplaced, setUnplaced] = useState<string[]>([]);
  const [announcement, setAnnouncement] = useState('');
  return {
    resultFor: (query: Query): Result | null =>
      checked && checked.key === JSON.stringify(query) ? checked.result : null,
    /** Keeps the API's answer, and says in a sentence what it was for screen readers. */
    remember: (query: Query, result: Result, sentence: string) => {
      setUnplaced([]);
      setChecked({ key: JSON.stringify(query), result });
      setAnnouncement(sentence);
    },
    refused: (error: unknown) => {
      setAnnouncement('');
      setUnplaced(applyServerFieldErrors(error, form.setError));
    },
    unplaced,
    /** For a LiveMessage: the live preview changes with every key, so only answers are read out. */
    announcement,
  };
}
