import { useState } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import { FormProvider, useFieldArray, useForm, useWatch } from 'react-hook-form';

import { MAX_SOUNDER_MINUTES } from '@server/calc/power';
import { GRADES } from '@server/schema/fields';
import { PSU_TYPES } from '@server/systems/schema';
import { labelInRow } from '@/components/forms/row-label';
import { Button } from '@/components/ui/button';
import { LiveMessage } from '@/components/ui/live-message';
import { Notice } from '@/components/ui/notice';
import { PowerBudgetSummary } from '@/components/ui/power-budget-summary';
import {
  useCalculatePowerBudget,
  type PowerBudgetQuery,
} from '@/features/calculators/api/calculate-power-budget';
import { CalculationProblem } from '@/features/calculators/components/calculation-problem';
import {
  CalculateButton,
  CheckboxInput,
  NumberInput,
  ResultSource,
  SelectInput,
  TextInput,
} from '@/features/calculators/components/calculator-fields';
import {
  NEW_POWER_ITEM,
  POWER_FORM_START,
  toPowerQuery,
  type PowerFormValues,
} from '@/features/calculators/utils/calculator-forms';
import { previewPowerBudget } from '@/features/calculators/utils/previews';
import { useCheckedResult } from '@/features/calculators/utils/use-checked-result';
import type { PowerBudgetFigures } from '@/lib/calc-result-schemas';
import { countFieldErrors } from '@/lib/form-errors';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';

/** The standby battery a list of powered items needs, with the same display as a site's budget. */
export function PowerBudgetCalculator() {
  const form = useForm<PowerFormValues>({ defaultValues: POWER_FORM_START });
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'items' });
  const focusAfterRender = useFocusAfterRender();
  const [rowMessage, setRowMessage] = useState('');
  const values = useWatch({ control: form.control }) as PowerFormValues;
  const query = toPowerQuery({ ...POWER_FORM_START, ...values, items: values.items ?? [] });
  const checked = useCheckedResult<PowerBudgetQuery, PowerBudgetFigures, PowerFormValues>(form);
  const calculate = useCalculatePowerBudget({
    onSuccess: (result, sent) =>
      checked.remember(
        sent,
        result,
        `Checked: ${result.requiredAh} Ah needed${result.passes === null ? '' : result.passes ? '; the battery passes' : '; the battery is too small'}.`,
      ),
    onError: checked.refused,
  });
  const fromServer = checked.resultFor(query);
  const preview = fromServer ?? previewPowerBudget(query);
  const psuType = values.psuType;

  return (
    <FormProvider {...form}>
      <form
        noValidate
        className="grid gap-5"
        onSubmit={form.handleSubmit((submitted) => calculate.mutate(toPowerQuery(submitted)))}
      >
        <CalculationProblem
          error={calculate.error}
          unplaced={checked.unplaced}
          fieldErrorCount={countFieldErrors(form.formState.errors)}
        />
        <fieldset className="grid gap-3">
          <legend className="mb-1 text-sm font-semibold">Powered items</legend>
          <ol aria-label="Powered items" className="grid gap-3">
            {fields.map((field, index) => {
              const row = index + 1;
              return (
                <li
                  key={field.id}
                  className="grid items-start gap-3 rounded-md border border-hairline p-3 sm:grid-cols-[minmax(0,1fr)_8rem_8rem_6rem_auto]"
                >
                  <TextInput
                    name={`items.${index}.label`}
                    label="Item"
                    accessibleLabel={labelInRow('Item', row)}
                  />
                  <NumberInput
                    name={`items.${index}.quiescentMa`}
                    label="Quiescent (mA)"
                    accessibleLabel={labelInRow('Quiescent (mA)', row)}
                    required="Enter the current in mA."
                  />
                  <NumberInput
                    name={`items.${index}.alarmMa`}
                    label="In alarm (mA)"
                    accessibleLabel={labelInRow('In alarm (mA)', row)}
                    required="Enter the current in mA."
                  />
                  <NumberInput
                    name={`items.${index}.count`}
                    label="How many"
                    accessibleLabel={labelInRow('How many', row)}
                  />
                  <Button
                    id={`power-item-${field.id}-remove`}
                    variant="secondary"
                    className="min-w-10 px-2 sm:mt-6"
                    aria-label={`Remove item, row ${row}`}
                    title="Remove item"
                    disabled={fields.length === 1}
                    onClick={() => {
                      remove(index);
                      const next = fields[index + 1] ?? fields[index - 1];
                      focusAfterRender(
                        next ? `power-item-${next.id}-remove` : 'add-power-item',
                        'add-power-item',
                      );
                      setRowMessage(`Item in row ${row} removed.`);
                    }}
                  >
                    <Trash2 aria-hidden="true" className="size-4" />
                  </Button>
                </li>
              );
            })}
          </ol>
          <div>
            <Button
              id="add-power-item"
              variant="secondary"
              onClick={() => {
                append(NEW_POWER_ITEM, { focusName: `items.${fields.length}.label` });
                setRowMessage(`Item ${fields.length + 1} added.`);
              }}
            >
              <Plus aria-hidden="true" className="size-4" />
              Add item
            </Button>
          </div>
        </fieldset>
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          <SelectInput
            name="grade"
            label="System grade"
            hint="Sets the standby time for type A supplies."
          >
            {GRADES.map((grade) => (
              <option key={grade} value={grade}>
                Grade {grade}
              </option>
            ))}
          </SelectInput>
          <SelectInput name="psuType" label="Power supply type" hint="EN 50131-6 type A, B or C.">
            {PSU_TYPES.map((type) => (
              <option key={type} value={type}>
                Type {type}
              </option>
            ))}
          </SelectInput>
          <NumberInput
            name="standbyHoursOverride"
            label="Standby time override (hours)"
            optional
            hint={
              psuType === 'A'
                ? 'Leave empty to use the EN 50131-6 period for the grade.'
                : `Needed for type ${psuType}: its standby time is not in Wardbook's table.`
            }
          />
          <NumberInput
            name="alarmMinutes"
            label="Alarm time (minutes)"
            hint={`The sounder cut-off, 1 to ${MAX_SOUNDER_MINUTES}; 15 is usual.`}
          />
          <NumberInput
            name="batteryAh"
            label="Battery fitted (Ah)"
            optional
            hint="To see whether it passes."
          />
          <div className="self-end">
            <CheckboxInput
              name="mainsFailureSignalled"
              label="Mains failure is signalled"
              hint="Shortens the standby time at grades 3 and 4."
            />
          </div>
        </div>
        <div>
          <CalculateButton label="Calculate power budget" isPending={calculate.isPending} />
        </div>
        {preview === null ? (
          <p className="text-sm text-ink-muted">
            Enter every item&rsquo;s currents to see the battery it needs.
          </p>
        ) : 'unavailable' in preview ? (
          <Notice tone="info" title="No standby time for this supply">
            <p>{preview.unavailable}</p>
          </Notice>
        ) : (
          <div className="grid gap-3">
            <ResultSource checked={fromServer !== null} />
            <PowerBudgetSummary budget={preview} items={query.items} />
          </div>
        )}
        <LiveMessage message={checked.announcement || rowMessage} />
      </form>
    </FormProvider>
  );
}
