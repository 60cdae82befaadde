import { FormProvider, useForm, useWatch } from 'react-hook-form';

import { RESISTOR_TOLERANCES } from '@server/systems/schema';
import { LOOP_WIRING_LABELS, LOOP_WIRINGS } from '@server/zones/schema';
import { LiveMessage } from '@/components/ui/live-message';
import {
  useCalculateLoop,
  type LoopQuery,
  type LoopResult,
} from '@/features/calculators/api/calculate-loop';
import { CableFields } from '@/features/calculators/components/cable-fields';
import { CalculationProblem } from '@/features/calculators/components/calculation-problem';
import {
  CalculateButton,
  ResultSource,
  SelectInput,
  TextInput,
} from '@/features/calculators/components/calculator-fields';
import { LoopResultView } from '@/features/calculators/components/loop-result';
import {
  LOOP_FORM_START,
  toLoopQuery,
  type LoopFormValues,
} from '@/features/calculators/utils/calculator-forms';
import { previewLoop } from '@/features/calculators/utils/previews';
import { useCheckedResult } from '@/features/calculators/utils/use-checked-result';
import { countFieldErrors } from '@/lib/form-errors';
import { STATE_NAMES } from '@server/calc/loop';

/** A loop's bands for its wiring, resistors and cable, and what a meter reading on it means. */
export function LoopCalculator() {
  const form = useForm<LoopFormValues>({ defaultValues: LOOP_FORM_START });
  const values = useWatch({ control: form.control }) as LoopFormValues;
  const query = toLoopQuery({
    ...LOOP_FORM_START,
    ...values,
    cable: { ...LOOP_FORM_START.cable, ...values.cable },
  });
  const checked = useCheckedResult<LoopQuery, LoopResult, LoopFormValues>(form);
  const calculate = useCalculateLoop({
    onSuccess: (result, sent) =>
      checked.remember(
        sent,
        result,
        result.classification
          ? `Checked: the reading is ${STATE_NAMES[result.classification.state].toLowerCase()}.`
          : `Checked: ${result.bands.length} bands${result.problems.length > 0 ? ', with a design problem' : ''}.`,
      ),
    onError: checked.refused,
  });
  const fromServer = checked.resultFor(query);
  const result = fromServer ?? previewLoop(query);
  const wiring = values.wiring;

  return (
    <FormProvider {...form}>
      <form
        noValidate
        className="grid gap-5"
        onSubmit={form.handleSubmit((submitted) => calculate.mutate(toLoopQuery(submitted)))}
      >
        <CalculationProblem
          error={calculate.error}
          unplaced={checked.unplaced}
          fieldErrorCount={countFieldErrors(form.formState.errors)}
        />
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-4">
          <SelectInput name="wiring" label="Loop wiring" className="sm:col-span-2">
            {LOOP_WIRINGS.map((option) => (
              <option key={option} value={option}>
                {LOOP_WIRING_LABELS[option]}
              </option>
            ))}
          </SelectInput>
          {wiring === 'two_resistor' ? (
            <TextInput
              name="tamperOhms"
              label="Tamper resistor (series)"
              hint="e.g. 2K2 or 2200"
              mono
            />
          ) : null}
          {wiring !== 'closed_loop_separate_tamper' ? (
            <TextInput
              name="alarmOhms"
              label={wiring === 'two_resistor' ? 'Alarm resistor' : 'End-of-line resistor'}
              hint="e.g. 4K7 or 4700"
              mono
            />
          ) : null}
          <SelectInput name="tolerance" label="Resistor tolerance">
            {RESISTOR_TOLERANCES.map((tolerance) => (
              <option key={tolerance} value={tolerance}>
                ±{Math.round(tolerance * 100)} %
              </option>
            ))}
          </SelectInput>
        </div>
        <fieldset className="grid gap-3 rounded-md border border-hairline p-4">
          <legend className="px-1 text-sm font-semibold">Cable</legend>
          <CableFields prefix="cable." runOptional />
        </fieldset>
        <div className="flex flex-wrap items-end gap-4">
          <TextInput
            name="reading"
            label="Reading to check (Ω)"
            hint="As the meter shows it: 2210, 2k21, 2.21 kΩ, or OL for an open circuit."
            optional
            mono
          />
          <CalculateButton label="Check loop" isPending={calculate.isPending} />
        </div>
        <div className="grid gap-3">
          {result ? (
            <>
              <ResultSource checked={fromServer !== null} />
              <LoopResultView query={query} result={result} />
            </>
          ) : (
            <p className="text-sm text-ink-muted">
              Enter the resistor values (and the cable run, if you know it) to see the bands.
            </p>
          )}
        </div>
        <LiveMessage message={checked.announcement} />
      </form>
    </FormProvider>
  );
}
