import { useMutation, useQueryClient } from '@tanstack/react-query';

import {
  alertSchema,
  getMyAlertsQueryOptions,
  type Alert,
} from '@/features/alerts/api/get-my-alerts';
import { api } from '@/lib/api-client';
import type { MutationConfig } from '@/lib/query-client';

export type AlertResponse = 'attending' | 'cannot_attend';
export type RespondToAlertVariables = { eventId: string; response: AlertResponse };

/** The keyholder's answer, as a reply by text would give it; 409 once the alert is over. */
export function respondToAlert({ eventId, response }: RespondToAlertVariables) {
  return api.post(
    `/api/my/alerts/${encodeURIComponent(eventId)}/response`,
    { response },
    alertSchema,
  );
}

export function useRespondToAlert({
  mutationConfig,
}: { mutationConfig?: MutationConfig<Alert, RespondToAlertVariables> } = {}) {
  const queryClient = useQueryClient();
  const { onSuccess, onError, ...restConfig } = mutationConfig ?? {};
  const alertsKey = getMyAlertsQueryOptions().queryKey;
  return useMutation({
    ...restConfig,
    mutationFn: respondToAlert,
    onSuccess: async (...args) => {
      const updated = args[0];
      queryClient.setQueryData(alertsKey, (alerts) =>
        alerts
          ? {
              ...alerts,
              active: alerts.active.map((alert) =>
                alert.eventId === updated.eventId ? updated : alert,
              ),
            }
          : alerts,
      );
      await queryClient.invalidateQueries({ queryKey: alertsKey });
      await onSuccess?.(...args);
    },
    onError: async (...args) => {
      // A 409 means the alert ended meanwhile: show it where it now belongs.
      await queryClient.invalidateQueries({ queryKey: alertsKey });
      await onError?.(...args);
    },
  });
}
