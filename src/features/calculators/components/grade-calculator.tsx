import { useState } from 'react';
import { Info, Medal, Plus, Trash2 } from 'lucide-react';
import { FormProvider, useFieldArray, useForm, useWatch } from 'react-hook-form';

import { GRADES } from '@server/schema/fields';
import { labelInRow } from '@/components/forms/row-label';
import { Button } from '@/components/ui/button';
import { LiveMessage } from '@/components/ui/live-message';
import {
  useCalculateGrade,
  type GradeQuery,
  type GradeResult,
} from '@/features/calculators/api/calculate-grade';
import { CalculationProblem } from '@/features/calculators/components/calculation-problem';
import {
  CalculateButton,
  ResultSource,
  SelectInput,
  TextInput,
  Working,
} from '@/features/calculators/components/calculator-fields';
import {
  GRADE_FORM_START,
  toGradeQuery,
  type GradeFormValues,
} from '@/features/calculators/utils/calculator-forms';
import { previewGrade } from '@/features/calculators/utils/previews';
import { useCheckedResult } from '@/features/calculators/utils/use-checked-result';
import { countFieldErrors } from '@/lib/form-errors';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';

function GradeResultView({ query, result }: { query: GradeQuery; result: GradeResult }) {
  const graded = query.components.filter((component) => component.grade !== null);
  return (
    <div className="grid gap-3">
      <p className="flex items-start gap-2 rounded-md border border-l-4 border-hairline border-l-info bg-white p-3 font-semibold">
        {result.grade === null ? (
          <Info aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-info" />
        ) : (
          <Medal aria-hidden="true" className="mt-0.5 size-5 shrink-0 text-info" />
        )}
        <span>
          {result.grade === null
            ? 'No grade yet: none of the parts has a grade.'
            : `System grade ${result.grade}, set by ${result.limitedBy.join(', ')}`}
        </span>
      </p>
      {result.ungraded.length > 0 ? (
        <p className="text-sm">
          <span className="font-semibold">Not confirmed:</span> {result.ungraded.join(', ')}{' '}
          {result.ungraded.length === 1 ? 'has' : 'have'} no grade, and could lower it.
        </p>
      ) : null}
      {graded.length > 0 ? (
        <Working
          lines={[
            `Lowest of (${graded.map((component) => component.grade).join(', ')}) = ${result.grade}`,
            'EN 50131-1: a system is graded by its lowest-graded part.',
          ]}
        />
      ) : null}
    </div>
  );
}

/** A system's grade from its parts: the lowest, and which parts set it. */
export function GradeCalculator() {
  const form = useForm<GradeFormValues>({ defaultValues: GRADE_FORM_START });
  const { fields, append, remove } = useFieldArray({ control: form.control, name: 'components' });
  const focusAfterRender = useFocusAfterRender();
  const [rowMessage, setRowMessage] = useState('');
  const values = useWatch({ control: form.control }) as GradeFormValues;
  const query = toGradeQuery({ components: values.components ?? [] });
  const checked = useCheckedResult<GradeQuery, GradeResult, GradeFormValues>(form);
  const calculate = useCalculateGrade({
    onSuccess: (result, sent) =>
      checked.remember(
        sent,
        result,
        result.grade === null ? 'Checked: no grade yet.' : `Checked: system grade ${result.grade}.`,
      ),
    onError: checked.refused,
  });
  const fromServer = checked.resultFor(query);
  const result = fromServer ?? previewGrade(query);

  return (
    <FormProvider {...form}>
      <form
        noValidate
        className="grid gap-5"
        onSubmit={form.handleSubmit((submitted) => calculate.mutate(toGradeQuery(submitted)))}
      >
        <CalculationProblem
          error={calculate.error}
          unplaced={checked.unplaced}
          fieldErrorCount={countFieldErrors(form.formState.errors)}
        />
        <fieldset className="grid gap-3">
          <legend className="mb-1 text-sm font-semibold">Parts of the system</legend>
          <ol aria-label="Parts of the system" className="grid gap-3">
            {fields.map((field, index) => {
              const row = index + 1;
              return (
                <li
                  key={field.id}
                  className="grid items-start gap-3 rounded-md border border-hairline p-3 sm:grid-cols-[minmax(0,1fr)_12rem_auto]"
                >
                  <TextInput
                    name={`components.${index}.label`}
                    label="Part"
                    accessibleLabel={labelInRow('Part', row)}
                  />
                  <SelectInput
                    name={`components.${index}.grade`}
                    label="Grade"
                    accessibleLabel={labelInRow('Grade', row)}
                  >
                    <option value="">Not recorded</option>
                    {GRADES.map((grade) => (
                      <option key={grade} value={grade}>
                        Grade {grade}
                      </option>
                    ))}
                  </SelectInput>
                  <Button
                    id={`grade-part-${field.id}-remove`}
                    variant="secondary"
                    className="min-w-10 px-2 sm:mt-6"
                    aria-label={`Remove part, row ${row}`}
                    title="Remove part"
                    disabled={fields.length === 1}
                    onClick={() => {
                      remove(index);
                      const next = fields[index + 1] ?? fields[index - 1];
                      focusAfterRender(
                        next ? `grade-part-${next.id}-remove` : 'add-grade-part',
                        'add-grade-part',
                      );
                      setRowMessage(`Part in row ${row} removed.`);
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
              id="add-grade-part"
              variant="secondary"
              onClick={() => {
                append(
                  { label: '', grade: '' },
                  { focusName: `components.${fields.length}.label` },
                );
                setRowMessage(`Part ${fields.length + 1} added.`);
              }}
            >
              <Plus aria-hidden="true" className="size-4" />
              Add part
            </Button>
          </div>
        </fieldset>
        <div>
          <CalculateButton label="Work out grade" isPending={calculate.isPending} />
        </div>
        {result ? (
          <div className="grid gap-3">
            <ResultSource checked={fromServer !== null} />
            <GradeResultView query={query} result={result} />
          </div>
        ) : null}
        <LiveMessage message={checked.announcement || rowMessage} />
      </form>
    </FormProvider>
  );
}
