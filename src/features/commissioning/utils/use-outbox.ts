import { useCallback, useEffect, useRef, useState, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';

import {
  flushOutbox,
  isSessionProblem,
  isOutboxStorageRefused,
  outboxEntries,
  removeFromOutbox,
  submitRecord,
  subscribeToOutbox,
  type OutboxEntry,
  type OutboxScope,
  type SubmitOutcome,
} from '@/features/commissioning/utils/outbox';
import { ApiError } from '@/lib/api-client';
import { refreshSiteChecks } from '@/lib/refresh-site-checks';

/** How often waiting records are tried again while the page is open (besides `online` events). */
const RETRY_EVERY_MS = 20_000;

export type OutboxState = {
  entries: OutboxEntry[];
  /** Waiting to be sent (refused ones are listed, but not retried). */
  waiting: OutboxEntry[];
  isSending: boolean;
  /** Why the last try stopped: no connection, or the session ended. */
  lastProblem: 'offline' | 'signed-out' | 'server' | null;
  storageRefused: boolean;
  /** A sentence for screen readers after a send ("2 records sent"). */
  announcement: string;
  sendNow: () => void;
  discard: (clientKey: string) => void;
  /** Sends a record now, or keeps it on the phone if the connection fails. */
  submit: (entry: OutboxEntry) => Promise<SubmitOutcome>;
};

function problemOf(error: unknown): OutboxState['lastProblem'] {
  if (!error) return null;
  if (isSessionProblem(error)) return 'signed-out';
  if (error instanceof ApiError) return 'server';
  return 'offline';
}

const plural = (count: number) => `${count} ${count === 1 ? 'record' : 'records'}`;

/**
 * The site's outbox for a screen: what is waiting, and sending it when the page opens, when the
 * browser says it is back online, and every 20 seconds while anything waits.
 */
type UseOutboxOptions = OutboxScope & {
  /**
   * Fetches the signed-in person again, which renews this page's security token; true when
   * still (or again) signed in. Used when sending stopped because the session had ended, so the
   * records go once the engineer has signed in again in another tab.
   */
  renewSession: () => Promise<boolean>;
};

export function useOutbox({ userId, siteId, renewSession }: UseOutboxOptions): OutboxState {
  const queryClient = useQueryClient();
  const entries = useSyncExternalStore(subscribeToOutbox, () => outboxEntries({ userId, siteId }));
  const waiting = entries.filter((entry) => !entry.refusal);
  const [isSending, setIsSending] = useState(false);
  const [lastProblem, setLastProblem] = useState<OutboxState['lastProblem']>(null);
  const [announcement, setAnnouncement] = useState('');
  const hasWaiting = waiting.length > 0;

  const sendNow = useCallback(async () => {
    const scope = { userId, siteId };
    if (outboxEntries(scope).every((entry) => entry.refusal)) return;
    if (typeof navigator !== 'undefined' && navigator.onLine === false) {
      setLastProblem('offline');
      return;
    }
    setIsSending(true);
    try {
      let result = await flushOutbox(scope);
      if (isSessionProblem(result.stoppedBy) && (await renewSession())) {
        result = await flushOutbox(scope);
      }
      setLastProblem(problemOf(result.stoppedBy));
      if (result.sent > 0 || result.refused > 0) {
        refreshSiteChecks(queryClient, siteId);
        setAnnouncement(
          [
            result.sent > 0 ? `${plural(result.sent)} sent from this phone.` : '',
            result.refused > 0 ? `${plural(result.refused)} refused: see the list.` : '',
          ]
            .filter(Boolean)
            .join(' '),
        );
      }
    } finally {
      setIsSending(false);
    }
  }, [queryClient, renewSession, siteId, userId]);

  // Always the latest, for the listeners set up once below.
  const sendNowRef = useRef(sendNow);
  useEffect(() => {
    sendNowRef.current = sendNow;
  }, [sendNow]);

  useEffect(() => {
    void sendNowRef.current();
    const onOnline = () => void sendNowRef.current();
    window.addEventListener('online', onOnline);
    return () => window.removeEventListener('online', onOnline);
  }, [siteId, userId]);

  useEffect(() => {
    if (!hasWaiting) return;
    const timer = window.setInterval(() => void sendNowRef.current(), RETRY_EVERY_MS);
    return () => window.clearInterval(timer);
  }, [hasWaiting]);

  const submit = useCallback(
    async (entry: OutboxEntry) => {
      const outcome = await submitRecord({ userId, siteId }, entry);
      if (outcome.outcome === 'sent') refreshSiteChecks(queryClient, siteId);
      else setLastProblem(problemOf(outcome.because));
      return outcome;
    },
    [queryClient, siteId, userId],
  );

  return {
    entries,
    waiting,
    isSending,
    lastProblem,
    storageRefused: isOutboxStorageRefused(),
    announcement,
    sendNow: () => void sendNow(),
    discard: (clientKey) => removeFromOutbox({ userId, siteId }, clientKey),
    submit,
  };
}
