import { OUTCOME_LABELS, OUTCOMES, type Outcome } from '@server/monitoring/schema';
import { CircleCheck } from 'lucide-react';
import { useState } from 'react';
import { useForm, useWatch } from 'react-hook-form';

import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmButton } from '@/components/ui/confirm-button';
import { FormField } from '@/components/ui/form-field';
import { selectClassName } from '@/components/ui/form-styles';
import type { AlarmEventDetail } from '@/features/monitoring/api/get-alarm-event';
import { useCloseAlarmEvent } from '@/features/monitoring/api/close-alarm-event';
import { ActionProblem } from '@/features/monitoring/components/action-problem';
import { NoteField } from '@/features/monitoring/components/note-field';
import { ApiError } from '@/lib/api-client';
import { isFalseAlarmOutcome } from '@/utils/alarm-words';

type CloseValues = { outcome: Outcome | ''; note: string };

type CloseEventFormProps = {
  detail: AlarmEventDetail;
  /** After closing: the screen moves focus to the event's new state. */
  onClosed: () => void;
};

/** Closing the event with how it ended: chosen, then confirmed, since it cannot be reopened. */
export function CloseEventForm({ detail, onClosed }: CloseEventFormProps) {
  const form = useForm<CloseValues>({ defaultValues: { outcome: '', note: '' } });
  const {
    register,
    formState: { errors },
  } = form;
  const [confirmKey, setConfirmKey] = useState(0);
  const closeEvent = useCloseAlarmEvent({
    mutationConfig: {
      onSuccess: () => onClosed(),
      onError: (error) => {
        // Back to the first step, so the reason sits beside the fields with nothing lost.
        setConfirmKey((key) => key + 1);
        if (!(error instanceof ApiError)) return;
        for (const { path, message } of error.fieldErrors) {
          const field = path.replace(/^body\./, '');
          if (field === 'outcome' || field === 'note') form.setError(field, { message });
        }
      },
    },
  });
  const outcome = useWatch({ control: form.control, name: 'outcome' });
  const outcomeError = errors.outcome?.message;

  const submit = form.handleSubmit((values) => {
    if (!values.outcome) {
      setConfirmKey((key) => key + 1);
      form.setError('outcome', { message: 'Choose how the event ended.' }, { shouldFocus: true });
      return;
    }
    closeEvent.mutate({
      eventId: detail.event.id,
      input: { outcome: values.outcome, note: values.note.trim() },
    });
  });

  return (
    <Card title="Close the event" icon={CircleCheck}>
      <form noValidate className="grid gap-4" onSubmit={(event) => event.preventDefault()}>
        <div className="grid gap-4 md:grid-cols-2">
          <FormField label="Outcome" error={outcomeError}>
            {(fieldProps) => (
              <select {...fieldProps} {...register('outcome')} className={selectClassName()}>
                <option value="">Choose…</option>
                {OUTCOMES.map((value) => (
                  <option key={value} value={value}>
                    {OUTCOME_LABELS[value]}
                  </option>
                ))}
              </select>
            )}
          </FormField>
          <NoteField
            registration={register('note')}
            hint="What you found out, e.g. who set it off."
            error={errors.note?.message}
          />
        </div>
        {isFalseAlarmOutcome(outcome || null) ? (
          <p className="text-sm">
            A false alarm counts against the site's police response for 12 months (NPCC policy).
          </p>
        ) : null}
        {closeEvent.error ? (
          <ActionProblem
            title="The event was not closed; what you chose is still here."
            error={closeEvent.error}
            shownFields={['outcome', 'note']}
          />
        ) : null}
        <div className="flex flex-wrap gap-2">
          {outcome ? (
            <ConfirmButton
              key={confirmKey}
              variant="primary"
              question={`Close this event as “${OUTCOME_LABELS[outcome]}”? It cannot be reopened.`}
              confirmLabel="Yes, close the event"
              onConfirm={() => void submit()}
              pending={closeEvent.isPending}
            >
              Close the event…
            </ConfirmButton>
          ) : (
            // Nothing to confirm yet: the same button says what is missing, beside the field.
            <Button onClick={() => void submit()}>Close the event…</Button>
          )}
        </div>
      </form>
    </Card>
  );
}
