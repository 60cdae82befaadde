import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { FormField } from '@/components/ui/form-field';
import { inputClassName } from '@/components/ui/form-styles';

type NoteFieldProps = {
  /** `register('note')` from the form the note belongs to. */
  registration: UseFormRegisterReturn;
  error?: string;
  hint?: ReactNode;
};

/** The optional free-text note every action on an event may carry onto the timeline. */
export function NoteField({ registration, error, hint }: NoteFieldProps) {
  return (
    <FormField label="Note" optional hint={hint} error={error}>
      {(fieldProps) => (
        <input
          {...fieldProps}
          {...registration}
          type="text"
          maxLength={1000}
          className={inputClassName()}
        />
      )}
    </FormField>
  );
}
