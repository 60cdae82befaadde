import { History } from 'lucide-react';

import { Card } from '@/components/ui/card';
import type { Alert } from '@/features/alerts/api/get-my-alerts';
import { eventLabel, outcomeLabel } from '@/utils/alarm-words';
import { formatDateTime } from '@/utils/format';

const RESPONSE_WORDS = { attending: 'You attended', cannot_attend: 'You could not attend' };

/** Earlier alarms at the sites this person holds keys for, and how each ended. */
export function PastAlertsList({ alerts }: { alerts: readonly Alert[] }) {
  return (
    <Card title="Earlier alarms" icon={History} flush>
      {alerts.length === 0 ? (
        <p className="px-4 py-4">No earlier alarms at the homes you hold keys for.</p>
      ) : (
        <ul aria-label="Earlier alarms" className="divide-y divide-hairline">
          {alerts.map((alert) => (
            <li key={alert.eventId} className="grid gap-0.5 px-4 py-3">
              <p className="font-semibold">
                {eventLabel(alert.category, alert.confirmed)} at {alert.siteName}
              </p>
              <p className="text-sm text-ink-muted">
                <time dateTime={alert.raisedAt}>{formatDateTime(alert.raisedAt)}</time>
              </p>
              <p>
                {alert.myResponse ? RESPONSE_WORDS[alert.myResponse] : 'You did not answer'}.{' '}
                {alert.closedAt ? `Outcome: ${outcomeLabel(alert.outcome)}.` : ''}
              </p>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
