import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

import { FormField } from '@/components/ui/form-field';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import { cn } from '@/utils/cn';

/*
 * Fields for commissioning on a phone, one-handed: 48 px tall, 16 px text so the phone does not
 * zoom, and readings in the monospaced face.
 */

type TouchTextFieldProps = {
  label: string;
  hint?: ReactNode;
  error?: string;
  optional?: boolean;
  registration: UseFormRegisterReturn;
  /** Readings and volts: monospaced, not spell-checked, no capitals forced. */
  reading?: boolean;
  inputMode?: 'text' | 'decimal' | 'numeric';
  className?: string;
  children?: ReactNode;
};

export function TouchTextField({
  label,
  hint,
  error,
  optional,
  registration,
  reading = false,
  inputMode,
  className,
  children,
}: TouchTextFieldProps) {
  return (
    <FormField label={label} hint={hint} error={error} optional={optional} className={className}>
      {(control) => (
        <>
          <input
            {...control}
            {...registration}
            type="text"
            inputMode={inputMode}
            autoComplete="off"
            autoCapitalize="off"
            spellCheck={reading ? false : undefined}
            className={touchInputClassName({
              invalid: Boolean(error),
              className: cn(reading && 'max-w-56 font-mono'),
            })}
          />
          {children}
        </>
      )}
    </FormField>
  );
}

export function TouchNoteField({
  label = 'Note',
  registration,
  error,
}: {
  /** Named after its form where several share a screen: "Siting note", "Battery test note". */
  label?: string;
  registration: UseFormRegisterReturn;
  error?: string;
}) {
  return (
    <FormField label={label} optional error={error}>
      {(control) => (
        <textarea
          {...control}
          {...registration}
          rows={2}
          className={touchInputClassName({ invalid: Boolean(error) })}
        />
      )}
    </FormField>
  );
}

/** A large checkbox whose whole row is the target; its name is its label alone. */
export function TouchCheckbox({
  label,
  registration,
}: {
  label: string;
  registration: UseFormRegisterReturn;
}) {
  return (
    <label className="flex min-h-12 cursor-pointer items-center gap-3 rounded-md border border-hairline bg-white px-3 py-2">
      <input type="checkbox" {...registration} className="size-6 shrink-0 accent-ink" />
      <span className="text-base">{label}</span>
    </label>
  );
}
