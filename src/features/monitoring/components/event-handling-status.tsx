import type { AlarmEvent } from '@server/monitoring/schema';
import { CircleCheck, Hourglass, UserCheck } from 'lucide-react';

/** Who is dealing with an event, in words: waiting for someone, taken by whom, or closed. */
export function EventHandlingStatus({ event, myUserId }: { event: AlarmEvent; myUserId: string }) {
  if (event.status === 'closed') {
    return (
      <span className="inline-flex items-center gap-1.5">
        <CircleCheck aria-hidden="true" className="size-4 shrink-0 text-normal" />
        Closed
      </span>
    );
  }
  if (event.status === 'taken') {
    const mine = event.takenById === myUserId;
    return (
      <span className="inline-flex items-center gap-1.5">
        <UserCheck aria-hidden="true" className="size-4 shrink-0 text-info" />
        {mine ? (
          <span className="font-semibold">Taken by you</span>
        ) : (
          <span>Taken by {event.takenBy ?? 'another operator'}</span>
        )}
      </span>
    );
  }
  return (
    <span className="inline-flex items-center gap-1.5 font-semibold">
      <Hourglass aria-hidden="true" className="size-4 shrink-0 text-alarm" />
      Waiting to be taken
    </span>
  );
}
