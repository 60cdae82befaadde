import { useState } from 'react';

import { LiveMessage } from '@/components/ui/live-message';
import { LoadingStatus } from '@/components/ui/loading-status';
import { ProblemAlert } from '@/components/ui/problem-alert';
import { useMyAlerts } from '@/features/alerts/api/get-my-alerts';
import { useRespondToAlert, type AlertResponse } from '@/features/alerts/api/respond-to-alert';
import { ActiveAlertCard } from '@/features/alerts/components/active-alert-card';
import { PastAlertsList } from '@/features/alerts/components/past-alerts-list';

/** The alerts part of the keyholder's home: any alarm going on now first, earlier ones after. */
export function ActiveAlerts() {
  const { data: alerts, isPending, error } = useMyAlerts();
  const [announcement, setAnnouncement] = useState('');
  const respond = useRespondToAlert({
    mutationConfig: {
      onSuccess: (alert) =>
        setAnnouncement(
          alert.myResponse === 'attending'
            ? `Sent: you are on your way to ${alert.siteName}.`
            : `Sent: you cannot attend ${alert.siteName}.`,
        ),
    },
  });

  if (isPending) return <LoadingStatus label="Checking for alarms" />;
  if (error) {
    return (
      <ProblemAlert
        error={error}
        hint="Alarms could not be checked just now. If the monitoring centre texts you, reply to the text."
      />
    );
  }

  return (
    <>
      {respond.error ? (
        <ProblemAlert
          error={respond.error}
          hint="Your answer was not sent. If the alarm is still going on, try again or reply to the text."
        />
      ) : null}
      {alerts.active.length > 0 ? (
        <ul aria-label="Alarms now" className="grid gap-4">
          {alerts.active.map((alert) => (
            <li key={alert.eventId}>
              <ActiveAlertCard
                alert={alert}
                isSending={respond.isPending && respond.variables?.eventId === alert.eventId}
                onRespond={(response: AlertResponse) => {
                  setAnnouncement('');
                  respond.mutate({ eventId: alert.eventId, response });
                }}
              />
            </li>
          ))}
        </ul>
      ) : null}
      <LiveMessage message={announcement} />
    </>
  );
}

/** Earlier alarms, lower on the page; the loading and error states are shown by ActiveAlerts. */
export function PastAlerts() {
  const { data: alerts } = useMyAlerts();
  if (!alerts) return null;
  return <PastAlertsList alerts={alerts.past} />;
}
