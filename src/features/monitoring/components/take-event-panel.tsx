import { Hand } from 'lucide-react';

import { Button } from '@/components/ui/button';
import type { AlarmEventDetail } from '@/features/monitoring/api/get-alarm-event';
import { useTakeAlarmEvent } from '@/features/monitoring/api/take-alarm-event';
import { ActionProblem } from '@/features/monitoring/components/action-problem';
import { EventHandlingStatus } from '@/features/monitoring/components/event-handling-status';
import { outcomeLabel } from '@/utils/alarm-words';
import { formatDuration } from '@/utils/elapsed';

type TakeEventPanelProps = {
  detail: AlarmEventDetail;
  myUserId: string;
  /** After taking: the screen moves focus to the actions that have just become available. */
  onTaken: () => void;
};

/** Who has the event, the button to take it, and how long taking and closing took. */
export function TakeEventPanel({ detail, myUserId, onTaken }: TakeEventPanelProps) {
  const { event, handling } = detail;
  const takeEvent = useTakeAlarmEvent({ mutationConfig: { onSuccess: () => onTaken() } });

  return (
    <section
      aria-labelledby="handling-heading"
      className="grid gap-3 rounded-lg border border-hairline bg-white px-4 py-3 md:px-5"
    >
      <div className="flex flex-wrap items-center gap-x-4 gap-y-2">
        <h2 id="handling-heading" tabIndex={-1} className="text-base font-semibold">
          Handling
        </h2>
        <p className="text-sm" aria-live="polite">
          <EventHandlingStatus event={event} myUserId={myUserId} />
          {event.status === 'closed' ? (
            <span className="ml-2 font-semibold">{outcomeLabel(event.outcome)}</span>
          ) : null}
        </p>
        {event.status === 'open' ? (
          <Button
            className="ml-auto"
            disabled={takeEvent.isPending}
            onClick={() => takeEvent.mutate(event.id)}
          >
            <Hand aria-hidden="true" className="size-4" />
            {takeEvent.isPending ? 'Taking…' : 'Take this event'}
          </Button>
        ) : null}
      </div>
      {takeEvent.error ? (
        <ActionProblem title="The event was not taken." error={takeEvent.error} />
      ) : null}
      {event.status === 'taken' && event.takenById !== myUserId ? (
        <p className="text-sm text-ink-muted">
          Only {event.takenBy ?? 'the operator who took it'} can message keyholders, record calls
          and close it.
        </p>
      ) : null}
      {handling.secondsToTake !== null || handling.secondsToClose !== null ? (
        <dl className="flex flex-wrap gap-x-6 text-sm">
          {[
            { term: 'Time to take', seconds: handling.secondsToTake },
            { term: 'Time to close', seconds: handling.secondsToClose },
          ].map(({ term, seconds }) => (
            <div key={term} className="flex gap-1.5">
              <dt className="text-ink-muted">{term}</dt>
              <dd className="font-mono">{seconds === null ? '–' : formatDuration(seconds)}</dd>
            </div>
          ))}
        </dl>
      ) : null}
    </section>
  );
}
