import { useId, type ReactNode } from 'react';
import { CircleAlert } from 'lucide-react';

import { cn } from '@/utils/cn';

/** Attributes a field's control spreads onto itself so its label, hint and error reach it. */
export type FieldControlProps = {
  id: string;
  'aria-describedby'?: string;
  'aria-invalid'?: true;
  'aria-label'?: string;
};

type FormFieldProps = {
  label: string;
  /**
   * A fuller name for screen readers when the visible label repeats on every row ("Location,
   * row 3"). It must start with the visible label, so speech users can say what they see.
   */
  accessibleLabel?: string;
  hint?: ReactNode;
  error?: string;
  /** Small labels for dense rows of fields. */
  compact?: boolean;
  /** Says "(optional)" after the label; fields are otherwise expected to be filled in. */
  optional?: boolean;
  className?: string;
  children: (control: FieldControlProps) => ReactNode;
};

export function FormField({
  label,
  accessibleLabel,
  hint,
  error,
  compact = false,
  optional = false,
  className,
  children,
}: FormFieldProps) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ');

  return (
    <div className={cn('min-w-0', className)}>
      <label
        htmlFor={id}
        className={cn('block font-medium text-ink', compact ? 'mb-0.5 text-xs' : 'mb-1 text-sm')}
      >
        {label}
        {optional ? <span className="font-normal text-ink-muted"> (optional)</span> : null}
      </label>
      {hint ? (
        <p
          id={hintId}
          className={cn('text-ink-muted', compact ? 'mb-0.5 text-xs' : 'mb-1 text-sm')}
        >
          {hint}
        </p>
      ) : null}
      {children({
        id,
        'aria-describedby': describedBy || undefined,
        'aria-invalid': error ? true : undefined,
        'aria-label': accessibleLabel,
      })}
      <FieldErrorMessage id={errorId} message={error} compact={compact} />
    </div>
  );
}

type FieldErrorMessageProps = { id?: string; message?: string; compact?: boolean };

/** An error beside its field: an icon and words, never colour alone. */
export function FieldErrorMessage({ id, message, compact = false }: FieldErrorMessageProps) {
  if (!message) return null;
  return (
    <p
      id={id}
      className={cn(
        'mt-1 flex items-start gap-1 font-medium text-alarm',
        compact ? 'text-xs' : 'text-sm',
      )}
    >
      <CircleAlert aria-hidden="true" className="mt-0.5 size-3.5 shrink-0" />
      <span>{message}</span>
    </p>
  );
}
