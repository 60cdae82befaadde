import type { ReactNode } from 'react';
import { Calculator } from 'lucide-react';
import { get, useFormContext, type RegisterOptions } from 'react-hook-form';

import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';
import { cn } from '@/utils/cn';

/*
 * Fields for the calculators. Figures are typed as text and read when sent, so a minus sign
 * (−10 °C) and resistor codes (4K7) can be typed on any phone keyboard; a client check says when
 * something is not a number, and the API says what else is wrong.
 */

type CalculatorFieldProps = {
  /** The field's path in the form, which is also its path in the API's request body. */
  name: string;
  label: string;
  hint?: ReactNode;
  optional?: boolean;
  className?: string;
};

/** The message for a nested field ("cable.runMetres", "items.2.alarmMa"), if it has one. */
const errorAt = (errors: unknown, name: string) =>
  (get(errors, name) as { message?: string } | undefined)?.message;

const isNumberText = (value: unknown) =>
  typeof value !== 'string' || value.trim() === '' || Number.isFinite(Number(value));

export function NumberInput({
  name,
  label,
  hint,
  optional = false,
  className,
  required,
  accessibleLabel,
}: CalculatorFieldProps & {
  /** The message when it is left empty; without one, empty means "use the default". */
  required?: string;
  accessibleLabel?: string;
}) {
  const {
    register,
    formState: { errors },
  } = useFormContext();
  const rules: RegisterOptions = {
    validate: {
      number: (value) => isNumberText(value) || 'Enter a number, e.g. 12.5.',
      ...(required
        ? {
            required: (value: unknown) =>
              (typeof value === 'string' && value.trim() !== '') || required,
          }
        : {}),
    },
  };
  return (
    <FormField
      label={label}
      accessibleLabel={accessibleLabel}
      hint={hint}
      optional={optional}
      error={errorAt(errors, name)}
      className={className}
    >
      {(control) => (
        <input
          {...control}
          {...register(name, rules)}
          type="text"
          inputMode="decimal"
          autoComplete="off"
          spellCheck={false}
          className={inputClassName({ mono: true, className: 'max-w-40' })}
        />
      )}
    </FormField>
  );
}

export function TextInput({
  name,
  label,
  hint,
  optional = false,
  className,
  mono = false,
  accessibleLabel,
}: CalculatorFieldProps & { mono?: boolean; accessibleLabel?: string }) {
  const {
    register,
    formState: { errors },
  } = useFormContext();
  return (
    <FormField
      label={label}
      accessibleLabel={accessibleLabel}
      hint={hint}
      optional={optional}
      error={errorAt(errors, name)}
      className={className}
    >
      {(control) => (
        <input
          {...control}
          {...register(name)}
          type="text"
          autoComplete="off"
          spellCheck={mono ? false : undefined}
          className={inputClassName({ mono, className: mono ? 'max-w-48' : undefined })}
        />
      )}
    </FormField>
  );
}

export function SelectInput({
  name,
  label,
  hint,
  className,
  children,
  accessibleLabel,
}: CalculatorFieldProps & { children: ReactNode; accessibleLabel?: string }) {
  const {
    register,
    formState: { errors },
  } = useFormContext();
  return (
    <FormField
      label={label}
      accessibleLabel={accessibleLabel}
      hint={hint}
      error={errorAt(errors, name)}
      className={className}
    >
      {(control) => (
        <select {...control} {...register(name)} className={selectClassName()}>
          {children}
        </select>
      )}
    </FormField>
  );
}

export function CheckboxInput({
  name,
  label,
  hint,
}: {
  name: string;
  label: string;
  hint?: string;
}) {
  const { register } = useFormContext();
  const hintId = `${name.replace(/\W/g, '-')}-hint`;
  return (
    <label className="flex min-h-11 items-start gap-3">
      <input
        type="checkbox"
        {...register(name)}
        aria-describedby={hint ? hintId : undefined}
        className="mt-1 size-5 shrink-0 accent-ink"
      />
      <span>
        <span className="block text-sm font-medium">{label}</span>
        {hint ? (
          <span id={hintId} className="block text-sm text-ink-muted">
            {hint}
          </span>
        ) : null}
      </span>
    </label>
  );
}

/** Where a calculation came from: worked out live in the browser, or answered by the API. */
export function ResultSource({ checked, className }: { checked: boolean; className?: string }) {
  return (
    <p className={cn('text-sm text-ink-muted', className)}>
      {checked
        ? 'Result from Wardbook’s server for the figures above.'
        : 'Live preview, worked out as you type. Press the button to have Wardbook’s server check it.'}
    </p>
  );
}

/** The sum behind a result, written out so it can be checked by hand. */
export function Working({
  lines,
  title = 'Working',
}: {
  lines: readonly string[];
  title?: string;
}) {
  if (lines.length === 0) return null;
  return (
    <div>
      <p className="text-sm font-semibold">{title}</p>
      <div className="mt-1 grid gap-1 rounded-md bg-paper px-3 py-2 font-mono text-sm break-words">
        {lines.map((line) => (
          <p key={line}>{line}</p>
        ))}
      </div>
    </div>
  );
}

/** A calculator's submit button: disabled while the API is asked, so it is not asked twice. */
export function CalculateButton({ label, isPending }: { label: string; isPending: boolean }) {
  return (
    <Button type="submit" disabled={isPending}>
      <Calculator aria-hidden="true" className="size-4" />
      {label}
    </Button>
  );
}
