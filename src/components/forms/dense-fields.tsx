import type { InputHTMLAttributes, ReactNode } from 'react';
import type {
  Control,
  FieldPath,
  FieldValues,
  RegisterOptions,
  UseFormRegisterReturn,
} from 'react-hook-form';

import { FormField, type FieldControlProps } from '@/components/ui/form-field';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';

/*
 * Fields for the dense rows of the list editors (zone schedule, devices, signalling paths, areas):
 * a small label over a dense control. The visible label repeats on every row, so each field also
 * takes the fuller name a screen reader says ("Location, row 3").
 */

type DenseFieldProps<Values extends FieldValues> = {
  label: string;
  accessibleLabel: string;
  error?: string;
  className?: string;
  /** The form's control and the field's path in it, as for react-hook-form's own Controller. */
  control: Control<Values>;
  name: FieldPath<Values>;
  /** How the control's text becomes what the schema expects: `numberOrNull`, `parseOhms`, … */
  registerOptions?: RegisterOptions<Values, FieldPath<Values>>;
};

/**
 * The field registers itself as it renders, as a `register` call inside `FormField` would, so
 * the form knows its fields in the order they stand: after a failed save, react-hook-form puts
 * focus on the first field in error in that order.
 */
function DenseField<Values extends FieldValues>({
  control,
  name,
  registerOptions,
  children,
  ...field
}: DenseFieldProps<Values> & {
  children: (controlProps: FieldControlProps & UseFormRegisterReturn) => ReactNode;
}) {
  return (
    <FormField {...field} compact>
      {(fieldControl) => children({ ...fieldControl, ...control.register(name, registerOptions) })}
    </FormField>
  );
}

type DenseTextFieldProps<Values extends FieldValues> = DenseFieldProps<Values> & {
  /** Codes and values (2k2, SP2, a terminal number): monospaced, and not spell-checked. */
  code?: boolean;
  controlClassName?: string;
};

export function DenseTextField<Values extends FieldValues>({
  code = false,
  controlClassName,
  ...field
}: DenseTextFieldProps<Values>) {
  return (
    <DenseField {...field}>
      {(control) => (
        <input
          {...control}
          className={inputClassName({ size: 'dense', mono: code, className: controlClassName })}
          autoComplete="off"
          spellCheck={code ? false : undefined}
        />
      )}
    </DenseField>
  );
}

type DenseNumberFieldProps<Values extends FieldValues> = DenseFieldProps<Values> &
  Required<Pick<InputHTMLAttributes<HTMLInputElement>, 'min' | 'inputMode'>> &
  Pick<InputHTMLAttributes<HTMLInputElement>, 'max' | 'step'>;

export function DenseNumberField<Values extends FieldValues>({
  min,
  max,
  step,
  inputMode,
  ...field
}: DenseNumberFieldProps<Values>) {
  return (
    <DenseField {...field}>
      {(control) => (
        <input
          {...control}
          type="number"
          step={step}
          min={min}
          max={max}
          inputMode={inputMode}
          className={inputClassName({ size: 'dense', mono: true })}
        />
      )}
    </DenseField>
  );
}

export function DenseSelectField<Values extends FieldValues>({
  children,
  ...field
}: DenseFieldProps<Values> & { children: ReactNode }) {
  return (
    <DenseField {...field}>
      {(control) => (
        <select {...control} className={selectClassName({ size: 'dense' })}>
          {children}
        </select>
      )}
    </DenseField>
  );
}

type RequiredChoiceOptionsProps<Value extends string> = {
  values: readonly Value[];
  labels: Record<Value, string>;
};

/**
 * The options of a choice the record needs: it starts on "Choose…", which cannot be chosen back,
 * so the shared schema asks for a choice rather than Wardbook guessing what was fitted.
 */
export function RequiredChoiceOptions<Value extends string>({
  values,
  labels,
}: RequiredChoiceOptionsProps<Value>) {
  return (
    <>
      <option value="" disabled>
        Choose…
      </option>
      {values.map((value) => (
        <option key={value} value={value}>
          {labels[value]}
        </option>
      ))}
    </>
  );
}
