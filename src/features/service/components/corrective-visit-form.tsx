import { useRef, useState, type FormEvent } from 'react';
import { Plus, Trash2 } from 'lucide-react';

import {
  correctiveCompletionSchema,
  PRIME_CAUSE_LABELS,
  PRIME_CAUSE_SOURCE,
  PRIME_CAUSES,
  type CompletedVisit,
  type CorrectiveCompletionInput,
  type PrimeCause,
  type ServiceVisit,
} from '@server/service/schema';
import { Button } from '@/components/ui/button';
import { FormField } from '@/components/ui/form-field';
import { touchInputClassName } from '@/components/ui/touch-field-styles';
import { useCompleteVisit } from '@/features/service/api/complete-visit';
import {
  ChoiceGroup,
  VisitNoteField,
  VisitTextField,
  VisitFormProblems,
} from '@/features/service/components/visit-form-fields';
import {
  errorsFromApi,
  errorsFromIssues,
  type FieldErrors,
} from '@/features/service/utils/field-errors';
import { useCompletionKey } from '@/features/service/utils/completion-key';

type PartRow = { rowKey: string; part: string; quantity: string };

type CorrectiveVisitFormProps = {
  visit: ServiceVisit;
  onCompleted: (visit: CompletedVisit) => void;
};

/** A call-out's record: the fault as found, its prime cause, what was done and fitted. */
export function CorrectiveVisitForm({ visit, onCompleted }: CorrectiveVisitFormProps) {
  const clientKey = useCompletionKey(visit.id);
  const [reportedFault, setReportedFault] = useState(visit.reportedFault ?? '');
  const [primeCause, setPrimeCause] = useState<PrimeCause | ''>('');
  const [actionTaken, setActionTaken] = useState('');
  const [parts, setParts] = useState<PartRow[]>([]);
  const [falseAlarm, setFalseAlarm] = useState<'yes' | 'no' | ''>('');
  const [falseAlarmCause, setFalseAlarmCause] = useState('');
  const [note, setNote] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [refusal, setRefusal] = useState<unknown>(null);
  const summaryRef = useRef<HTMLDivElement>(null);
  const complete = useCompleteVisit({ mutationConfig: { onSuccess: onCompleted } });

  const updatePart = (rowKey: string, change: Partial<PartRow>) =>
    setParts((rows) => rows.map((row) => (row.rowKey === rowKey ? { ...row, ...change } : row)));

  function buildBody(): CorrectiveCompletionInput {
    return {
      kind: 'corrective',
      clientKey,
      completedAt: new Date().toISOString(),
      reportedFault: reportedFault.trim() === '' ? undefined : reportedFault,
      primeCause: (primeCause || undefined) as PrimeCause,
      actionTaken,
      partsReplaced: parts.map((row) => ({
        part: row.part,
        quantity: (row.quantity.trim() === '' ? undefined : Number(row.quantity)) as number,
      })),
      falseAlarm: (falseAlarm === '' ? undefined : falseAlarm === 'yes') as boolean,
      falseAlarmCause:
        falseAlarm === 'yes' && falseAlarmCause.trim() !== '' ? falseAlarmCause : undefined,
      note,
    };
  }

  async function submit(event: FormEvent) {
    event.preventDefault();
    setRefusal(null);
    const body = buildBody();
    const checked = correctiveCompletionSchema.safeParse(body);
    if (!checked.success) {
      setErrors(errorsFromIssues(checked.error.issues));
      requestAnimationFrame(() => summaryRef.current?.focus());
      return;
    }
    setErrors({});
    try {
      await complete.mutateAsync({ siteId: visit.siteId, visitId: visit.id, data: body });
    } catch (error) {
      setRefusal(error);
      setErrors(errorsFromApi(error));
      requestAnimationFrame(() => summaryRef.current?.focus());
    }
  }

  const errorCount = Object.keys(errors).length;
  return (
    <form
      noValidate
      onSubmit={submit}
      aria-label="Call-out record"
      className="grid gap-4 rounded-lg border border-hairline bg-white px-4 py-4"
    >
      <VisitFormProblems
        summaryRef={summaryRef}
        refusal={refusal}
        errorCount={errorCount}
        notDone="The call-out was not completed."
      />
      <VisitTextField
        label="Fault as found"
        hint="Starts as the fault reported when the call-out was booked."
        multiline
        value={reportedFault}
        onChange={setReportedFault}
        error={errors.reportedFault}
      />
      <FormField
        label="Prime cause"
        hint={`Wardbook’s list, ${PRIME_CAUSE_SOURCE}.`}
        error={errors.primeCause}
      >
        {(control) => (
          <select
            {...control}
            value={primeCause}
            onChange={(event) => setPrimeCause(event.target.value as PrimeCause | '')}
            className={touchInputClassName({ invalid: Boolean(errors.primeCause) })}
          >
            <option value="">Choose the prime cause</option>
            {PRIME_CAUSES.map((cause) => (
              <option key={cause} value={cause}>
                {PRIME_CAUSE_LABELS[cause]}
              </option>
            ))}
          </select>
        )}
      </FormField>
      <VisitTextField
        label="What you did"
        multiline
        value={actionTaken}
        onChange={setActionTaken}
        error={errors.actionTaken}
      />
      <fieldset className="grid gap-3">
        <legend className="mb-1 text-sm font-medium">Parts fitted</legend>
        {parts.length === 0 ? <p className="text-sm text-ink-muted">No parts fitted.</p> : null}
        {parts.map((row, index) => (
          <div key={row.rowKey} className="grid grid-cols-[1fr_6rem_auto] items-end gap-2">
            <VisitTextField
              label={`Part ${index + 1}`}
              value={row.part}
              onChange={(part) => updatePart(row.rowKey, { part })}
              error={errors[`partsReplaced.${index}.part`]}
            />
            <VisitTextField
              label="How many"
              inputMode="numeric"
              value={row.quantity}
              onChange={(quantity) => updatePart(row.rowKey, { quantity })}
              error={errors[`partsReplaced.${index}.quantity`]}
            />
            <Button
              variant="secondary"
              onClick={() =>
                setParts((rows) => rows.filter((other) => other.rowKey !== row.rowKey))
              }
            >
              <Trash2 aria-hidden="true" className="size-4" />
              <span className="sr-only">Remove part {index + 1}</span>
            </Button>
          </div>
        ))}
        <Button
          variant="secondary"
          onClick={() =>
            setParts((rows) => [...rows, { rowKey: crypto.randomUUID(), part: '', quantity: '1' }])
          }
        >
          <Plus aria-hidden="true" className="size-4" />
          Add a part
        </Button>
      </fieldset>
      <ChoiceGroup
        legend="Did the call-out follow a false alarm?"
        name="false-alarm"
        value={falseAlarm}
        choices={[
          { value: 'yes', label: 'Yes' },
          { value: 'no', label: 'No' },
        ]}
        onChange={setFalseAlarm}
        error={errors.falseAlarm}
      />
      {falseAlarm === 'yes' ? (
        <VisitTextField
          label="What caused the false alarm"
          hint="It goes on the site’s false-alarm record."
          multiline
          value={falseAlarmCause}
          onChange={setFalseAlarmCause}
          error={errors.falseAlarmCause}
        />
      ) : null}
      <VisitNoteField label="Call-out note" value={note} onChange={setNote} error={errors.note} />
      <Button type="submit" variant="primary" size="lg" disabled={complete.isPending}>
        {complete.isPending ? 'Sending…' : 'Complete the call-out'}
      </Button>
    </form>
  );
}
