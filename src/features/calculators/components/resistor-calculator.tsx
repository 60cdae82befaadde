import { FormProvider, useForm, useWatch } from 'react-hook-form';
import { CircleCheck, Info } from 'lucide-react';

import { formatOhms } from '@server/calc/notation';
import { LiveMessage } from '@/components/ui/live-message';
import {
  useCalculateResistance,
  type ResistanceResult,
} from '@/features/calculators/api/calculate-resistance';
import { CalculationProblem } from '@/features/calculators/components/calculation-problem';
import {
  CalculateButton,
  ResultSource,
  TextInput,
  Working,
} from '@/features/calculators/components/calculator-fields';
import { ResistorColourBands } from '@/features/calculators/components/resistor-colour-bands';
import { colourWorking } from '@/features/calculators/utils/colour-code';
import { previewResistance } from '@/features/calculators/utils/previews';
import { useCheckedResult } from '@/features/calculators/utils/use-checked-result';
import { countFieldErrors } from '@/lib/form-errors';

type ResistorFormValues = { value: string };

function PreferredLine({
  series,
  ohms,
  nearest,
  isPreferred,
}: {
  series: string;
  ohms: number;
  nearest: number;
  isPreferred: boolean;
}) {
  return (
    <p className="flex items-start gap-2 text-sm">
      {isPreferred ? (
        <CircleCheck aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-normal" />
      ) : (
        <Info aria-hidden="true" className="mt-0.5 size-4 shrink-0 text-info" />
      )}
      <span>
        {isPreferred ? (
          <>
            <span className="font-mono">{formatOhms(ohms)}</span> is an {series} preferred value.
          </>
        ) : (
          <>
            Not an {series} value; the nearest is{' '}
            <span className="font-mono font-semibold">{formatOhms(nearest)}</span>.
          </>
        )}
      </span>
    </p>
  );
}

function ResistanceResultView({ result }: { result: ResistanceResult }) {
  return (
    <div className="grid gap-4">
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-4">
        <div>
          <dt className="text-sm text-ink-muted">Ohms</dt>
          <dd className="font-mono text-lg font-semibold">
            {result.ohms.toLocaleString('en-GB')} Ω
          </dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Resistor code</dt>
          <dd className="font-mono text-lg font-semibold">{result.code}</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Said as</dt>
          <dd className="font-mono text-lg font-semibold">{result.spoken}</dd>
        </div>
      </dl>
      <div className="grid gap-1">
        <PreferredLine series="E12" ohms={result.ohms} {...result.e12} />
        <PreferredLine series="E24" ohms={result.ohms} {...result.e24} />
      </div>
      <div className="grid gap-6 sm:grid-cols-2">
        {result.fourBands ? (
          <ResistorColourBands title="Four bands (±5 %)" bands={result.fourBands} />
        ) : (
          <p className="text-sm text-ink-muted">
            No four-band code: the value needs more than two digits.
          </p>
        )}
        {result.fiveBands ? (
          <ResistorColourBands title="Five bands (±1 %)" bands={result.fiveBands} />
        ) : (
          <p className="text-sm text-ink-muted">No five-band code for this value.</p>
        )}
      </div>
      <Working
        lines={[
          'Code letters mark the decimal point: R × 1, K × 1,000, M × 1,000,000 (IEC 60062).',
          ...[result.fourBands, result.fiveBands].flatMap((bands) =>
            bands ? [colourWorking(bands)] : [],
          ),
          'Preferred values: the E12 and E24 tables of IEC 60063; nearest is by ratio, as tolerance is.',
        ]}
      />
    </div>
  );
}

/** Any notation in, every way of writing the value out, with its colour bands drawn and named. */
export function ResistorCalculator() {
  const form = useForm<ResistorFormValues>({ defaultValues: { value: '2K2' } });
  const value = useWatch({ control: form.control, name: 'value' });
  const checked = useCheckedResult<string, ResistanceResult, ResistorFormValues>(form);
  const calculate = useCalculateResistance({
    onSuccess: (result, query) =>
      checked.remember(query.value, result, `Checked: ${result.spoken}, code ${result.code}.`),
    onError: checked.refused,
  });
  const fromServer = checked.resultFor(value);
  const result = fromServer ?? previewResistance(value);

  return (
    <FormProvider {...form}>
      <form
        noValidate
        className="grid gap-4"
        onSubmit={form.handleSubmit((values) => calculate.mutate({ value: values.value }))}
      >
        <CalculationProblem
          error={calculate.error}
          unplaced={checked.unplaced}
          fieldErrorCount={countFieldErrors(form.formState.errors)}
        />
        <div className="flex flex-wrap items-end gap-4">
          <TextInput
            name="value"
            label="Resistor value"
            hint="Any notation: 2200, 2K2, 4k7, 470R, 0R5, 2.2 kΩ, 1M5."
            mono
          />
          <CalculateButton label="Look up resistor" isPending={calculate.isPending} />
        </div>
        <div className="grid gap-3">
          {result ? (
            <>
              <ResultSource checked={fromServer !== null} />
              <ResistanceResultView result={result} />
            </>
          ) : (
            <p className="text-sm text-ink-muted">
              Type a value to see it written every way, with its colour bands.
            </p>
          )}
        </div>
        <LiveMessage message={checked.announcement} />
      </form>
    </FormProvider>
  );
}
