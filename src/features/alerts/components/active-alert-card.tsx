import { CircleCheck, CircleX, Siren } from 'lucide-react';
import { useId } from 'react';

import { Button } from '@/components/ui/button';
import type { Alert } from '@/features/alerts/api/get-my-alerts';
import type { AlertResponse } from '@/features/alerts/api/respond-to-alert';
import { useNow } from '@/lib/use-now';
import { eventLabel } from '@/utils/alarm-words';
import { formatTimeAgo } from '@/utils/elapsed';
import { formatDateTime } from '@/utils/format';

const CALL_OUT_WORDS: Record<string, string> = {
  not_started: 'The monitoring centre has not asked keyholders to attend yet.',
  calling: 'The monitoring centre is asking keyholders in call order.',
  accepted: 'A keyholder has said they are on their way.',
  exhausted: 'No keyholder has been able to attend; the centre is following its procedure.',
  stood_down: 'The centre has stood keyholders down: you do not need to go.',
};

const timeOfDay = (iso: string) =>
  new Date(iso).toLocaleTimeString('en-GB', { hour: '2-digit', minute: '2-digit' });

type ActiveAlertCardProps = {
  alert: Alert;
  onRespond: (response: AlertResponse) => void;
  isSending: boolean;
};

/**
 * An alarm going on now at a site this person holds keys for: what, where and when, their answer
 * in two large buttons, and the cautions that come before the property.
 */
export function ActiveAlertCard({ alert, onRespond, isSending }: ActiveAlertCardProps) {
  const headingId = useId();
  const now = useNow();
  const what = eventLabel(alert.category, alert.confirmed);

  return (
    <article
      aria-labelledby={headingId}
      className="overflow-hidden rounded-lg border-2 border-alarm bg-white"
    >
      <div className="flex items-start gap-3 border-b border-hairline bg-paper px-4 py-3">
        <Siren aria-hidden="true" className="mt-1 size-7 shrink-0 text-alarm" />
        <div>
          <p className="text-sm font-bold tracking-wide text-alarm uppercase">Alarm now</p>
          <h2 id={headingId} className="text-xl font-semibold">
            {what} at {alert.siteName}
          </h2>
        </div>
      </div>
      <div className="grid gap-4 px-4 py-4 text-base">
        <dl className="grid gap-2">
          <div>
            <dt className="text-sm text-ink-muted">When</dt>
            <dd>
              <time dateTime={alert.raisedAt}>{formatDateTime(alert.raisedAt)}</time> (
              {formatTimeAgo(alert.raisedAt, now)})
            </dd>
          </div>
          <div>
            <dt className="text-sm text-ink-muted">Where</dt>
            <dd>
              <address className="not-italic">
                {(alert.address.length > 0 ? alert.address : [alert.town]).map((line, index) => (
                  <span key={`${index}-${line}`} className="block">
                    {line}
                  </span>
                ))}
              </address>
            </dd>
          </div>
          <div>
            <dt className="text-sm text-ink-muted">Monitoring centre</dt>
            <dd>
              {CALL_OUT_WORDS[alert.callOutStatus] ?? 'The monitoring centre is dealing with it.'}
            </dd>
          </div>
        </dl>

        <ul className="grid gap-2 rounded-md border-2 border-ink bg-paper p-3 text-base">
          <li>
            <span className="font-semibold">Do not go in if there are signs of forced entry.</span>{' '}
            Wait for the police at a safe distance.
          </li>
          <li>
            <span className="font-semibold">Do not go alone.</span> Take someone with you, or stay
            on the phone with the monitoring centre.
          </li>
          <li>
            <span className="font-semibold">Keep your phone on</span> so the centre can reach you.
          </li>
        </ul>

        <div role="group" aria-label="Can you attend?" className="grid gap-2 sm:grid-cols-2">
          <Button
            size="lg"
            aria-pressed={alert.myResponse === 'attending'}
            disabled={isSending}
            onClick={() => onRespond('attending')}
          >
            <CircleCheck aria-hidden="true" className="size-5" />
            I'm on my way
          </Button>
          <Button
            size="lg"
            variant="secondary"
            aria-pressed={alert.myResponse === 'cannot_attend'}
            disabled={isSending}
            onClick={() => onRespond('cannot_attend')}
          >
            <CircleX aria-hidden="true" className="size-5" />I can't attend
          </Button>
        </div>
        <p role="status" className="font-semibold">
          {isSending
            ? 'Sending your answer…'
            : alert.myResponse === 'attending'
              ? `You told the centre you are on your way${alert.respondedAt ? ` (${timeOfDay(alert.respondedAt)})` : ''}. Follow their instructions.`
              : alert.myResponse === 'cannot_attend'
                ? `You told the centre you cannot attend${alert.respondedAt ? ` (${timeOfDay(alert.respondedAt)})` : ''}. They will ask the next keyholder.`
                : 'You have not answered yet.'}
        </p>
      </div>
    </article>
  );
}
