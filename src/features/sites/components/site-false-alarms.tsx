import { ShieldAlert } from 'lucide-react';

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
        </div>
      )}
    </Card>
  );
}
