import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';

import {
  flushOutbox,
  isSessionProblem,
  scopesWithWaiting,
} from '@/features/commissioning/utils/outbox';
import { refreshSiteChecks } from '@/lib/refresh-site-checks';

/** How often the phone looks for waiting records while any staff page is open. */
const LOOK_EVERY_MS = 30_000;

type OutboxSenderProps = {
  userId: string;
  /** Fetches the signed-in person again (renewing the security token); true when still them. */
  renewSession: () => Promise<boolean>;
};

/**
 * Sends commissioning records kept on this phone for any site, from whichever page is open: an
 * engineer who drove on to the next job with the last site's tests still waiting does not have
 * to go back to that site's page. It draws nothing; the commissioning page shows the outbox.
 */
export function OutboxSender({ userId, renewSession }: OutboxSenderProps) {
  const queryClient = useQueryClient();
  useEffect(() => {
    let isRunning = false;
    const sendAll = async () => {
      if (isRunning || navigator.onLine === false) return;
      isRunning = true;
      try {
        for (const scope of scopesWithWaiting(userId)) {
          let result = await flushOutbox(scope);
          if (isSessionProblem(result.stoppedBy) && (await renewSession())) {
            result = await flushOutbox(scope);
          }
          if (result.sent > 0 || result.refused > 0) refreshSiteChecks(queryClient, scope.siteId);
          // No connection, or no session: the other sites would stop the same way.
          if (result.stoppedBy) break;
        }
      } finally {
        isRunning = false;
      }
    };
    void sendAll();
    const onOnline = () => void sendAll();
    window.addEventListener('online', onOnline);
    const timer = window.setInterval(() => void sendAll(), LOOK_EVERY_MS);
    return () => {
      window.removeEventListener('online', onOnline);
      window.clearInterval(timer);
    };
  }, [queryClient, renewSession, userId]);
  return null;
}
