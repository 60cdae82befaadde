import { zodResolver } from '@hookform/resolvers/zod';
import { Shield, ShieldCheck, ShieldOff } from 'lucide-react';
import { useForm } from 'react-hook-form';

import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { FormField } from '@/components/ui/form-field';
import { inputClassName } from '@/components/ui/form-styles';
import type { AlarmEventDetail } from '@/features/monitoring/api/get-alarm-event';
import {
  requestPoliceInputSchema,
  useRequestPolice,
  type RequestPoliceInput,
} from '@/features/monitoring/api/request-police';
import { ActionProblem } from '@/features/monitoring/components/action-problem';
import { NoteField } from '@/features/monitoring/components/note-field';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { useFocusAfterRender } from '@/lib/use-focus-after-render';
import { formatDateTime } from '@/utils/format';

const REQUESTED_ID = 'police-requested';

type PoliceRequestPanelProps = { detail: AlarmEventDetail; canAct: boolean };

/**
 * Police response for this event. Offered only where the API says the event is eligible (an
 * active URN and, for an intruder alarm, confirmation), with the URN to quote beside it;
 * otherwise the reason it is not.
 */
export function PoliceRequestPanel({ detail, canAct }: PoliceRequestPanelProps) {
  const { police } = detail;
  const form = useForm<RequestPoliceInput>({
    resolver: zodResolver(requestPoliceInputSchema),
    defaultValues: { incidentReference: '', note: '' },
  });
  const {
    register,
    formState: { errors },
  } = form;
  const focusAfterRender = useFocusAfterRender();
  // The form goes once the request is recorded: focus moves to the record of it.
  const requestPolice = useRequestPolice({
    mutationConfig: {
      onSuccess: () => focusAfterRender(REQUESTED_ID),
      onError: (error) => applyServerFieldErrors(error, form.setError),
    },
  });

  if (police.requestedAt) {
    return (
      <Card title="Police response" icon={ShieldCheck}>
        <p id={REQUESTED_ID} tabIndex={-1} className="text-sm">
          Police requested{' '}
          <time dateTime={police.requestedAt}>{formatDateTime(police.requestedAt)}</time>
          {police.urn ? (
            <>
              {' '}
              quoting URN <span className="font-mono font-semibold">{police.urn}</span>
            </>
          ) : null}
          {police.incidentReference ? (
            <>
              ; police reference{' '}
              <span className="font-mono font-semibold">{police.incidentReference}</span>
            </>
          ) : null}
          .
        </p>
      </Card>
    );
  }

  if (!police.eligible) {
    return (
      <Card title="Police response" icon={ShieldOff}>
        <p className="text-sm">
          <span className="font-semibold">Not available for this event: </span>
          {police.reason}
        </p>
      </Card>
    );
  }

  return (
    <Card title="Police response" icon={Shield}>
      <div className="grid gap-3 text-sm">
        <p>
          This event may be passed to the police. Quote URN{' '}
          <span className="font-mono text-base font-semibold">{police.urn}</span>.
        </p>
        {canAct ? (
          <form
            noValidate
            className="grid gap-3"
            onSubmit={form.handleSubmit((input) =>
              requestPolice.mutate({ eventId: detail.event.id, input }),
            )}
          >
            <div className="grid gap-3 md:grid-cols-2">
              <FormField
                label="Police reference"
                hint="The incident or log number the police gave you."
                error={errors.incidentReference?.message}
              >
                {(fieldProps) => (
                  <input
                    {...fieldProps}
                    {...register('incidentReference')}
                    type="text"
                    maxLength={60}
                    className={inputClassName({ mono: true })}
                  />
                )}
              </FormField>
              <NoteField registration={register('note')} error={errors.note?.message} />
            </div>
            {requestPolice.error ? (
              <ActionProblem
                title="The police request was not recorded; what you typed is still here."
                error={requestPolice.error}
                shownFields={['incidentReference', 'note']}
              />
            ) : null}
            <div>
              <Button type="submit" disabled={requestPolice.isPending}>
                <Shield aria-hidden="true" className="size-4" />
                {requestPolice.isPending ? 'Recording…' : 'Record the police request'}
              </Button>
            </div>
          </form>
        ) : (
          <p className="text-ink-muted">Take the event to record a police request.</p>
        )}
      </div>
    </Card>
  );
}
