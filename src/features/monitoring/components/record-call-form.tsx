import { PhoneCall } from 'lucide-react';
import { useRef, useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';

import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormField } from '@/components/ui/form-field';
import { inputClassName, selectClassName } from '@/components/ui/form-styles';
import { LiveMessage } from '@/components/ui/live-message';
import type { AlarmEventDetail } from '@/features/monitoring/api/get-alarm-event';
import {
  CALL_RESULT_LABELS,
  CALL_RESULTS,
  recordCallInputSchema,
  useRecordCall,
  type CallResult,
} from '@/features/monitoring/api/record-call';
import { ActionProblem } from '@/features/monitoring/components/action-problem';
import { NoteField } from '@/features/monitoring/components/note-field';
import { ApiError } from '@/lib/api-client';
import { formatPhoneForReading } from '@/lib/phone';

/** "someone-else", or a call-plan position as text: what the select holds. */
const SOMEONE_ELSE = 'someone-else';

type RecordCallValues = {
  callee: string;
  otherName: string;
  result: CallResult | '';
  note: string;
};

const blank: RecordCallValues = { callee: '', otherName: '', result: '', note: '' };

/** The operator notes a phone call they made: to whom, what came of it, anything to add. */
export function RecordCallForm({ detail }: { detail: AlarmEventDetail }) {
  const { callPlan } = detail;
  const form = useForm<RecordCallValues>({ defaultValues: blank });
  const {
    register,
    formState: { errors },
  } = form;
  const [announcement, setAnnouncement] = useState('');
  // The request's `who` is typed into "Their name" (a call-plan entry supplies its own).
  const showFieldError = (path: string, message: string) => {
    const field = path === 'who' ? 'otherName' : path;
    if (field === 'otherName' || field === 'result' || field === 'note') {
      form.setError(field, { type: 'validate', message });
    }
  };
  const calleeRef = useRef<HTMLSelectElement | null>(null);
  const recordCall = useRecordCall({
    mutationConfig: {
      onSuccess: (_detail, { input }) => {
        form.reset(blank);
        setAnnouncement(`Call to ${input.who} recorded in the timeline.`);
        calleeRef.current?.focus();
      },
      // What was typed stays in the form; the API's reasons go beside the fields they concern.
      onError: (error) => {
        if (!(error instanceof ApiError)) return;
        for (const { path, message } of error.fieldErrors) {
          showFieldError(path.replace(/^body\./, ''), message);
        }
      },
    },
  });
  const callee = useWatch({ control: form.control, name: 'callee' });
  const calleeField = register('callee', { required: 'Choose who you called.' });

  return (
    <Card title="Record a phone call" icon={PhoneCall}>
      <form
        noValidate
        className="grid gap-4"
        onSubmit={form.handleSubmit((values) => {
          setAnnouncement('');
          const keyholder = callPlan.find((entry) => String(entry.position) === values.callee);
          const parsed = recordCallInputSchema.safeParse({
            position: keyholder?.position ?? null,
            who: keyholder ? keyholder.name : values.otherName,
            result: values.result,
            note: values.note,
          });
          if (!parsed.success) {
            for (const issue of parsed.error.issues)
              showFieldError(String(issue.path[0]), issue.message);
            return;
          }
          recordCall.mutate({ eventId: detail.event.id, input: parsed.data });
        })}
      >
        <div className="grid gap-4 md:grid-cols-2">
          <FormField label="Who did you call?" error={errors.callee?.message}>
            {(fieldProps) => (
              <select
                {...fieldProps}
                {...calleeField}
                ref={(element) => {
                  calleeField.ref(element);
                  calleeRef.current = element;
                }}
                className={selectClassName()}
              >
                <option value="">Choose…</option>
                {callPlan.map((entry) => (
                  <option key={entry.position} value={String(entry.position)}>
                    {entry.position}. {entry.name} ({formatPhoneForReading(entry.phone)})
                  </option>
                ))}
                <option value={SOMEONE_ELSE}>Someone else</option>
              </select>
            )}
          </FormField>
          {callee === SOMEONE_ELSE ? (
            <FormField
              label="Their name"
              hint="And who they are, e.g. “Police control room”."
              error={errors.otherName?.message}
            >
              {(fieldProps) => (
                <input
                  {...fieldProps}
                  {...register('otherName')}
                  type="text"
                  maxLength={120}
                  className={inputClassName()}
                />
              )}
            </FormField>
          ) : null}
          <FormField label="What came of it?" error={errors.result?.message}>
            {(fieldProps) => (
              <select {...fieldProps} {...register('result')} className={selectClassName()}>
                <option value="">Choose…</option>
                {CALL_RESULTS.map((result) => (
                  <option key={result} value={result}>
                    {CALL_RESULT_LABELS[result]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
        </div>
        <NoteField registration={register('note')} error={errors.note?.message} />
        {recordCall.error ? (
          <ActionProblem
            title="The call was not recorded; what you typed is still here."
            error={recordCall.error}
            shownFields={['who', 'result', 'note']}
          />
        ) : null}
        <div>
          <Button type="submit" variant="secondary" disabled={recordCall.isPending}>
            <PhoneCall aria-hidden="true" className="size-4" />
            {recordCall.isPending ? 'Recording…' : 'Record the call'}
          </Button>
        </div>
        <LiveMessage message={announcement} />
      </form>
    </Card>
  );
}
