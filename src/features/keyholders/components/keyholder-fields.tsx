import { KEYHOLDER_TARGET_MINUTES } from '@server/keyholders/schema';
import { Plus } from 'lucide-react';
import { useFieldArray, useFormContext } from 'react-hook-form';

import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import type { KeyholderFormValues } from '@/features/keyholders/components/keyholder-form-values';
import { numberOrUndefined, textOrNull } from '@/lib/form-values';

/** The inputs shared by the add and edit forms; the form around them supplies the context. */
export function KeyholderFields() {
  const {
    register,
    control,
    formState: { errors },
  } = useFormContext<KeyholderFormValues>();
  const unavailable = useFieldArray({ control, name: 'unavailable' });

  return (
    <div className="grid gap-4 md:grid-cols-2">
      <FormField label="Full name" error={errors.name?.message}>
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('name')}
            type="text"
            autoComplete="off"
            className={touchInputClassName({ invalid: Boolean(errors.name) })}
          />
        )}
      </FormField>
      <FormField
        label="Mobile phone"
        hint="The monitoring centre rings and texts this number, e.g. 07700 900123."
        error={errors.phone?.message}
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('phone')}
            type="tel"
            autoComplete="off"
            className={touchInputClassName({
              invalid: Boolean(errors.phone),
              className: 'font-mono',
            })}
          />
        )}
      </FormField>
      <FormField
        label="Minutes to reach the site"
        hint={`Keyholders should be able to get there within ${KEYHOLDER_TARGET_MINUTES} minutes.`}
        error={errors.minutesToAttend?.message}
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('minutesToAttend', { setValueAs: numberOrUndefined })}
            type="text"
            inputMode="numeric"
            autoComplete="off"
            className={touchInputClassName({
              invalid: Boolean(errors.minutesToAttend),
              className: 'max-w-40 font-mono',
            })}
          />
        )}
      </FormField>
      <FormField
        label="Relation"
        optional
        hint="For example neighbour, son, friend."
        error={errors.relation?.message}
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('relation')}
            type="text"
            autoComplete="off"
            className={touchInputClassName({ invalid: Boolean(errors.relation) })}
          />
        )}
      </FormField>
      <FormField
        label="E-mail"
        optional
        hint="Needed to invite them to Wardbook."
        error={errors.email?.message}
        className="md:col-span-2"
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('email', { setValueAs: textOrNull })}
            type="email"
            autoComplete="off"
            className={touchInputClassName({ invalid: Boolean(errors.email) })}
          />
        )}
      </FormField>

      <fieldset className="grid gap-3 md:col-span-2">
        <legend className="font-semibold">
          Dates they cannot attend <span className="font-normal text-ink-muted">(optional)</span>
        </legend>
        <p className="text-sm text-ink-muted">
          Holidays or work away, so the monitoring centre can skip them on those days.
        </p>
        {unavailable.fields.map((field, index) => {
          const rowErrors = errors.unavailable?.[index];
          return (
            <div
              key={field.id}
              role="group"
              aria-label={`Dates away ${index + 1}`}
              className="grid gap-3 rounded-md border border-hairline bg-paper p-3 sm:grid-cols-[1fr_1fr_2fr_auto] sm:items-end"
            >
              <FormField label="From" error={rowErrors?.from?.message}>
                {(fieldProps) => (
                  <input
                    {...fieldProps}
                    {...register(`unavailable.${index}.from`)}
                    type="date"
                    className={touchInputClassName({ invalid: Boolean(rowErrors?.from) })}
                  />
                )}
              </FormField>
              <FormField label="To" error={rowErrors?.to?.message}>
                {(fieldProps) => (
                  <input
                    {...fieldProps}
                    {...register(`unavailable.${index}.to`)}
                    type="date"
                    className={touchInputClassName({ invalid: Boolean(rowErrors?.to) })}
                  />
                )}
              </FormField>
              <FormField label="Note" optional error={rowErrors?.note?.message}>
                {(fieldProps) => (
                  <input
                    {...fieldProps}
                    {...register(`unavailable.${index}.note`)}
                    type="text"
                    className={touchInputClassName({ invalid: Boolean(rowErrors?.note) })}
                  />
                )}
              </FormField>
              <Button variant="secondary" size="lg" onClick={() => unavailable.remove(index)}>
                Remove dates away {index + 1}
              </Button>
            </div>
          );
        })}
        <div>
          <Button
            variant="secondary"
            size="lg"
            onClick={() => unavailable.append({ from: '', to: '', note: '' })}
          >
            <Plus aria-hidden="true" className="size-5" />
            Add dates away
          </Button>
        </div>
        {errors.unavailable?.root?.message || errors.unavailable?.message ? (
          <p role="alert" className="text-sm font-semibold text-alarm">
            {errors.unavailable.root?.message ?? errors.unavailable.message}
          </p>
        ) : null}
      </fieldset>
    </div>
  );
}
