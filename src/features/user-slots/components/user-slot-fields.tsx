import { useFormContext } from 'react-hook-form';

import { FormField } from '@/components/ui/form-field';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import {
  parseAreaNumbers,
  type UserSlotFormValues,
} from '@/features/user-slots/components/user-slot-form-values';
import { numberOrUndefined, textOrNull } from '@/lib/form-values';

type UserSlotFieldsProps = {
  /** The slot number is chosen once, when the slot is first recorded. */
  showSlotNumber: boolean;
  /**
   * Installer staff choose level 2 or 3; homeowners record only level 2 (user) slots and cannot
   * change a slot's level, so for them the level is stated rather than asked.
   */
  accessLevel: 'choose' | 'user-only' | 'unchanged';
};

/**
 * The slot's holder, level, areas and dates. There is deliberately no field for the code itself:
 * codes are set at the keypad and never pass through Wardbook.
 */
export function UserSlotFields({ showSlotNumber, accessLevel }: UserSlotFieldsProps) {
  const {
    register,
    formState: { errors },
  } = useFormContext<UserSlotFormValues>();
  const areaError = errors.areaNumbers
    ? (errors.areaNumbers.message ?? 'Enter area numbers from 1 to 99, separated by commas.')
    : undefined;

  return (
    <div className="grid gap-4 md:grid-cols-2">
      {showSlotNumber ? (
        <FormField
          label="Slot number"
          hint="The user number the panel shows for this person."
          error={errors.slot?.message}
        >
          {(fieldProps) => (
            <input
              {...fieldProps}
              {...register('slot', { setValueAs: numberOrUndefined })}
              type="text"
              inputMode="numeric"
              autoComplete="off"
              className={touchInputClassName({
                invalid: Boolean(errors.slot),
                className: 'max-w-32 font-mono',
              })}
            />
          )}
        </FormField>
      ) : null}
      <FormField label="Holder name" error={errors.holderName?.message}>
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('holderName')}
            type="text"
            autoComplete="off"
            className={touchInputClassName({ invalid: Boolean(errors.holderName) })}
          />
        )}
      </FormField>
      {accessLevel === 'choose' ? (
        <FormField
          label="Access level"
          hint="EN 50131: level 2 sets and unsets; level 3 is for the maintaining engineer."
          error={errors.accessLevel?.message}
        >
          {(fieldProps) => (
            <select
              {...fieldProps}
              {...register('accessLevel', { setValueAs: numberOrUndefined })}
              className={touchInputClassName({ invalid: Boolean(errors.accessLevel) })}
            >
              <option value="2">Level 2 (user)</option>
              <option value="3">Level 3 (engineer)</option>
            </select>
          )}
        </FormField>
      ) : null}
      {accessLevel === 'user-only' ? (
        <div>
          <p className="font-semibold">Access level</p>
          <p>Level 2 (user): can set and unset the system.</p>
          <p className="text-sm text-ink-muted">
            Engineer (level 3) slots are recorded by your alarm company.
          </p>
        </div>
      ) : null}
      <FormField
        label="Areas"
        optional
        hint="Area numbers this person may set and unset, separated by commas, e.g. 1, 2."
        error={areaError}
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('areaNumbers', { setValueAs: parseAreaNumbers })}
            type="text"
            inputMode="numeric"
            autoComplete="off"
            className={touchInputClassName({ invalid: Boolean(errors.areaNumbers) })}
          />
        )}
      </FormField>
      <FormField label="Valid from" optional error={errors.validFrom?.message}>
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('validFrom', { setValueAs: textOrNull })}
            type="date"
            className={touchInputClassName({ invalid: Boolean(errors.validFrom) })}
          />
        )}
      </FormField>
      <FormField
        label="Valid to"
        optional
        hint="For a cleaner, a builder or a guest: the last day the slot should be used."
        error={errors.validTo?.message}
      >
        {(fieldProps) => (
          <input
            {...fieldProps}
            {...register('validTo', { setValueAs: textOrNull })}
            type="date"
            className={touchInputClassName({ invalid: Boolean(errors.validTo) })}
          />
        )}
      </FormField>
    </div>
  );
}
