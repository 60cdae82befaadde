import { Circle, CircleCheck, ShieldAlert } from 'lucide-react';

import { Card } from '@/components/ui/card';
import { FalseAlarmStanding } from '@/components/ui/false-alarm-standing';
import { LoadingStatus } from '@/components/ui/loading-status';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { useSiteFalseAlarms } from '@/features/sites/api/get-site-false-alarms';
import { categoryLabel, outcomeLabel } from '@/utils/alarm-words';
import { formatDateTime } from '@/utils/format';

/**
 * False alarms in the last 12 months, which decide the site's police response (NPCC policy):
 * the office sees the count, the standing, and each false alarm, to find and fix the cause.
 */
export function SiteFalseAlarms({ siteId }: { siteId: string }) {
  const { data, isPending, error } = useSiteFalseAlarms(siteId);
  return (
    <Card title="False alarms, last 12 months" icon={ShieldAlert}>
      {isPending ? (
        <LoadingStatus label="Counting false alarms" />
      ) : error ? (
        <ProblemAlert error={error} hint="The false-alarm count could not be loaded." />
      ) : (
        <div className="grid gap-3 text-sm">
          <FalseAlarmStanding falseAlarms={data} />
          {data.events.length > 0 ? (
            <ul aria-label="False alarms counted" className="grid gap-2">
              {data.events.map((event) => (
                <li key={event.id} className="border-t border-hairline pt-2">
                  <p className="font-medium">{categoryLabel(event.category)}</p>
                  <p className="text-ink-muted">
                    <time dateTime={event.at}>{formatDateTime(event.at)}</time>
                  </p>
                  <p>{outcomeLabel(event.outcome)}</p>
                </li>
              ))}
            </ul>
          ) : null}
          {data.reinstatement.needed ? (
            <section
              aria-label="Reinstating police response"
              className="border-t border-hairline pt-2"
            >
              <p className="font-medium">
                Reinstating police response: {data.reinstatement.met ? 'ready to apply' : 'not yet'}
              </p>
              <p className="text-ink-muted">
                {data.reinstatement.rule} ({data.reinstatement.source}).
              </p>
              <ul className="mt-1 grid gap-1">
                {data.reinstatement.items.map((item) => (
                  <li key={item.item} className="flex gap-2">
                    {item.met ? (
                      <CircleCheck
                        aria-hidden="true"
                        className="mt-0.5 size-4 shrink-0 text-normal"
                      />
                    ) : (
                      <Circle
                        aria-hidden="true"
                        className="mt-0.5 size-4 shrink-0 text-ink-muted"
                      />
                    )}
                    <span>
                      <span className="sr-only">{item.met ? 'Done: ' : 'Not done: '}</span>
                      {item.words}
                    </span>
                  </li>
                ))}
              </ul>
            </section>
          ) : null}
        </div>
      )}
    </Card>
  );
}
