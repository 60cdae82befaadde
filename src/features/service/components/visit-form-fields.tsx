import type { ReactNode, RefObject } from 'react';

import { FieldErrorMessage, FormField } from '@/components/ui/form-field';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { touchInputClassName, touchTextareaClassName } from '@/components/ui/touch-field-styles';
import { cn } from '@/utils/cn';

type TextFieldProps = {
  label: string;
  value: string;
  onChange: (value: string) => void;
  error?: string;
  hint?: ReactNode;
  optional?: boolean;
  /** Readings and volts: monospaced, a decimal keypad is not forced (OL is a reading too). */
  reading?: boolean;
  inputMode?: 'text' | 'decimal' | 'numeric';
  multiline?: boolean;
  children?: ReactNode;
};

/** One field sized for a phone (48 px, 16 px text so the browser does not zoom). */
export function VisitTextField({
  label,
  value,
  onChange,
  error,
  hint,
  optional,
  reading = false,
  inputMode,
  multiline = false,
  children,
}: TextFieldProps) {
  return (
    <FormField label={label} hint={hint} error={error} optional={optional}>
      {(control) => (
        <>
          {multiline ? (
            <textarea
              {...control}
              value={value}
              rows={3}
              onChange={(event) => onChange(event.target.value)}
              className={touchTextareaClassName({ invalid: Boolean(error), className: 'min-h-24' })}
            />
          ) : (
            <input
              {...control}
              type="text"
              value={value}
              inputMode={inputMode}
              autoComplete="off"
              spellCheck={reading ? false : undefined}
              onChange={(event) => onChange(event.target.value)}
              className={touchInputClassName({
                invalid: Boolean(error),
                className: cn(reading && 'max-w-56 font-mono'),
              })}
            />
          )}
          {children}
        </>
      )}
    </FormField>
  );
}

type ChoiceGroupProps<Value extends string> = {
  legend: string;
  name: string;
  value: Value | '';
  choices: readonly { value: Value; label: string }[];
  onChange: (value: Value) => void;
  error?: string;
};

/** Radio buttons whose whole row is the target (at least 48 px tall). */
export function ChoiceGroup<Value extends string>({
  legend,
  name,
  value,
  choices,
  onChange,
  error,
}: ChoiceGroupProps<Value>) {
  return (
    <fieldset className="min-w-0" aria-invalid={error ? true : undefined}>
      <legend className="mb-1 text-sm font-medium text-ink">{legend}</legend>
      <div className="flex flex-wrap gap-2">
        {choices.map((choice) => (
          <label
            key={choice.value}
            className={cn(
              'flex min-h-12 cursor-pointer items-center gap-2 rounded-md border bg-white px-3 py-2',
              value === choice.value ? 'border-2 border-ink' : 'border-hairline',
            )}
          >
            <input
              type="radio"
              name={name}
              value={choice.value}
              checked={value === choice.value}
              onChange={() => onChange(choice.value)}
              className="size-5 shrink-0 accent-ink"
            />
            <span className="text-base">{choice.label}</span>
          </label>
        ))}
      </div>
      <FieldErrorMessage message={error} />
    </fieldset>
  );
}

/** Free text, sized for a thumb. */
export function VisitNoteField(props: Omit<TextFieldProps, 'multiline' | 'optional'>) {
  return <VisitTextField {...props} multiline optional />;
}

type VisitFormProblemsProps = {
  /** Focused after a refused send, so a screen reader hears what went wrong first. */
  summaryRef: RefObject<HTMLDivElement | null>;
  refusal: unknown;
  errorCount: number;
  /** What was not done, e.g. "The visit was not completed." */
  notDone: string;
};

/** Above a visit form: the API's refusal, or how many fields need attention. */
export function VisitFormProblems({
  summaryRef,
  refusal,
  errorCount,
  notDone,
}: VisitFormProblemsProps) {
  return (
    <div ref={summaryRef} tabIndex={-1} className="focus:outline-none">
      {refusal ? (
        <ProblemAlert
          error={refusal}
          title={`${notDone} Nothing was lost: fix what is marked and send again.`}
        />
      ) : errorCount > 0 ? (
        <p role="alert" className="rounded-md border-2 border-alarm bg-white px-4 py-3 font-medium">
          {errorCount === 1 ? '1 thing needs' : `${errorCount} things need`} your attention: each is
          marked beside its field.
        </p>
      ) : null}
    </div>
  );
}
