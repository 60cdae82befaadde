import { CircleCheck, Siren } from 'lucide-react';
import { FormProvider, useForm, useWatch } from 'react-hook-form';

import { COPPER_TEMPERATURE_COEFFICIENT, coreAreaMm2 } from '@server/calc/cable';
import { LiveMessage } from '@/components/ui/live-message';
import {
  useCalculateCable,
  type CableQuery,
  type CableResult,
} from '@/features/calculators/api/calculate-cable';
import { CableFields } from '@/features/calculators/components/cable-fields';
import { CalculationProblem } from '@/features/calculators/components/calculation-problem';
import {
  CalculateButton,
  NumberInput,
  ResultSource,
  Working,
} from '@/features/calculators/components/calculator-fields';
import {
  CABLE_FORM_START,
  toCableQuery,
  type CableFormValues,
} from '@/features/calculators/utils/calculator-forms';
import { previewCable } from '@/features/calculators/utils/previews';
import { useCheckedResult } from '@/features/calculators/utils/use-checked-result';
import { countFieldErrors } from '@/lib/form-errors';
import { CABLE_CORE_BUILDS } from '@/lib/loop-readings';
import { cn } from '@/utils/cn';

const figure = (value: number, places = 2) => String(Number(value.toFixed(places)));

function cableWorking(query: CableQuery, result: CableResult): string[] {
  const {
    runMetres,
    coresPerLeg = 1,
    temperatureC = 20,
    supplyVolts = 13.7,
    minimumVolts = 9,
    currentMa,
  } = query;
  const amps = currentMa / 1000;
  const area = query.core
    ? `Core area: ${query.core.split('/')[0]} × π × ${figure(0.1, 1)}² = ${figure(coreAreaMm2(CABLE_CORE_BUILDS[query.core]), 4)} mm²`
    : `Core area: ${query.areaMm2} mm² (given)`;
  const areaMm2 = query.core ? coreAreaMm2(CABLE_CORE_BUILDS[query.core]) : (query.areaMm2 ?? 0);
  return [
    area,
    `Per metre: (1/58 Ω·mm²/m) ÷ ${figure(areaMm2, 4)} mm² × (1 + ${COPPER_TEMPERATURE_COEFFICIENT} × (${temperatureC} − 20)) = ${figure(result.ohmsPerMetre, 4)} Ω/m`,
    `Loop: 2 × ${runMetres} m × ${figure(result.ohmsPerMetre, 4)} Ω/m ÷ ${coresPerLeg} = ${figure(result.loopOhms)} Ω`,
    `At the detector: ${supplyVolts} V − ${figure(amps, 4)} A × ${figure(result.loopOhms)} Ω = ${figure(result.voltsAtDetector)} V`,
    result.longestRunMetres === null
      ? 'Longest run: no limit, as the detector draws no current.'
      : `Longest run: (${supplyVolts} − ${minimumVolts}) V × ${coresPerLeg} ÷ (2 × ${figure(amps, 4)} A × ${figure(result.ohmsPerMetre, 4)} Ω/m) = ${figure(result.longestRunMetres, 0)} m`,
  ];
}

function CableResultView({ query, result }: { query: CableQuery; result: CableResult }) {
  const minimumVolts = query.minimumVolts ?? 9;
  const enough = result.voltsAtDetector >= minimumVolts;
  const Icon = enough ? CircleCheck : Siren;
  return (
    <div className="grid gap-4">
      <p
        className={cn(
          'flex items-start gap-2 rounded-md border border-l-4 border-hairline bg-white p-3 font-semibold',
          enough ? 'border-l-normal' : 'border-l-alarm',
        )}
      >
        <Icon
          aria-hidden="true"
          className={cn('mt-0.5 size-5 shrink-0', enough ? 'text-normal' : 'text-alarm')}
        />
        <span>
          {enough
            ? `Enough voltage: ${figure(result.voltsAtDetector)} V at the detector, its minimum is ${minimumVolts} V`
            : `Too little voltage: ${figure(result.voltsAtDetector)} V at the detector, below its ${minimumVolts} V minimum`}
        </span>
      </p>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-3 sm:grid-cols-4">
        <div>
          <dt className="text-sm text-ink-muted">Per metre, one core</dt>
          <dd className="font-mono">{figure(result.ohmsPerMetre, 4)} Ω/m</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Loop resistance</dt>
          <dd className="font-mono">{figure(result.loopOhms)} Ω</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Volts at the detector</dt>
          <dd className="font-mono">{figure(result.voltsAtDetector)} V</dd>
        </div>
        <div>
          <dt className="text-sm text-ink-muted">Longest run</dt>
          <dd className="font-mono">
            {result.longestRunMetres === null
              ? 'no limit'
              : `${figure(result.longestRunMetres, 0)} m`}
          </dd>
        </div>
      </dl>
      <Working lines={cableWorking(query, result)} />
      <p className="text-sm text-ink-muted">Copper to IEC 60028: 1/58 Ω·mm²/m at 20 °C.</p>
    </div>
  );
}

/** Copper cable: its resistance, the volts a detector gets at the end, and how far it can go. */
export function CableCalculator() {
  const form = useForm<CableFormValues>({ defaultValues: CABLE_FORM_START });
  const values = useWatch({ control: form.control }) as CableFormValues;
  const query = toCableQuery({ ...CABLE_FORM_START, ...values });
  const checked = useCheckedResult<CableQuery, CableResult, CableFormValues>(form);
  const calculate = useCalculateCable({
    onSuccess: (result, sent) =>
      checked.remember(
        sent,
        result,
        `Checked: ${figure(result.loopOhms)} Ω of loop, ${figure(result.voltsAtDetector)} V at the detector.`,
      ),
    onError: checked.refused,
  });
  const fromServer = checked.resultFor(query);
  const result = fromServer ?? previewCable(query);

  return (
    <FormProvider {...form}>
      <form
        noValidate
        className="grid gap-5"
        onSubmit={form.handleSubmit((submitted) => calculate.mutate(toCableQuery(submitted)))}
      >
        <CalculationProblem
          error={calculate.error}
          unplaced={checked.unplaced}
          fieldErrorCount={countFieldErrors(form.formState.errors)}
        />
        <CableFields prefix="" />
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">
          <NumberInput
            name="currentMa"
            label="Detector current (mA)"
            hint="What the detector draws, from its data sheet."
            required="Enter the detector's current in mA."
          />
          <NumberInput
            name="supplyVolts"
            label="Supply voltage (V)"
            hint="At the panel, usually 13.7 V."
          />
          <NumberInput
            name="minimumVolts"
            label="Detector's minimum voltage (V)"
            hint="The lowest it works at, from its data sheet; often 9 V."
          />
        </div>
        <div>
          <CalculateButton label="Calculate cable" isPending={calculate.isPending} />
        </div>
        {result ? (
          <div className="grid gap-3">
            <ResultSource checked={fromServer !== null} />
            <CableResultView query={query} result={result} />
          </div>
        ) : (
          <p className="text-sm text-ink-muted">
            Enter the run and the current to see the figures.
          </p>
        )}
        <LiveMessage message={checked.announcement} />
      </form>
    </FormProvider>
  );
}
