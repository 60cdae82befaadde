import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useSyncExternalStore } from 'react';
import { z } from 'zod';

import { monitoringQueryKeys } from '@/features/monitoring/api/monitoring-query-keys';

export type StreamState = 'connecting' | 'live' | 'reconnecting';

const STREAM_URL = '/api/monitoring/stream';
const changeSchema = z.object({ eventId: z.string().nullable(), signalId: z.string().optional() });
type Change = z.infer<typeof changeSchema>;

type StreamListener = {
  onChange: (change: Change) => void;
  /** After a gap in the stream: changes may have been missed, so everything is refetched. */
  onResume: () => void;
};

// Kept open between the queue and an event's screen, so moving between them does not reconnect.
const CLOSE_AFTER_IDLE_MS = 5_000;
// The browser retries a dropped stream by itself, but not one the server refused (a 401 after
// the session lapsed, a proxy error page): that is retried here.
const RETRY_REFUSED_MS = 5_000;

/**
 * One EventSource per tab, shared by every screen that watches the monitoring queue. The API
 * sends `change` whenever an event or the queue changes (fed by PostgreSQL LISTEN/NOTIFY).
 */
const stream = {
  source: null as EventSource | null,
  state: 'connecting' as StreamState,
  hasBeenLive: false,
  listeners: new Set<StreamListener>(),
  stateListeners: new Set<() => void>(),
  closeTimer: undefined as ReturnType<typeof setTimeout> | undefined,
  retryTimer: undefined as ReturnType<typeof setTimeout> | undefined,

  setState(next: StreamState) {
    if (this.state === next) return;
    this.state = next;
    for (const listener of this.stateListeners) listener();
  },

  open() {
    clearTimeout(this.retryTimer);
    const source = new EventSource(STREAM_URL, { withCredentials: true });
    this.source = source;
    source.addEventListener('open', () => {
      if (this.hasBeenLive) for (const listener of this.listeners) listener.onResume();
      this.hasBeenLive = true;
      this.setState('live');
    });
    source.addEventListener('change', (message) => {
      let change: Change;
      try {
        change = changeSchema.parse(JSON.parse((message as MessageEvent<string>).data));
      } catch {
        return;
      }
      for (const listener of this.listeners) listener.onChange(change);
    });
    source.addEventListener('error', () => {
      if (source.readyState === EventSource.CLOSED) {
        source.close();
        if (this.source === source) this.source = null;
        this.retryTimer = setTimeout(() => {
          if (this.listeners.size > 0 && !this.source) this.open();
        }, RETRY_REFUSED_MS);
      }
      this.setState(this.hasBeenLive ? 'reconnecting' : 'connecting');
    });
  },

  close() {
    clearTimeout(this.retryTimer);
    this.source?.close();
    this.source = null;
    this.hasBeenLive = false;
    this.setState('connecting');
  },

  add(listener: StreamListener) {
    this.listeners.add(listener);
    clearTimeout(this.closeTimer);
    if (!this.source) this.open();
    return () => {
      this.listeners.delete(listener);
      if (this.listeners.size > 0) return;
      this.closeTimer = setTimeout(() => {
        if (this.listeners.size === 0) this.close();
      }, CLOSE_AFTER_IDLE_MS);
    };
  },

  subscribeToState(onStateChange: () => void) {
    stream.stateListeners.add(onStateChange);
    return () => stream.stateListeners.delete(onStateChange);
  },
};

// A burst of changes (a signal, its event, its timeline) is one refetch, not five.
const COALESCE_MS = 50;

/**
 * Keeps the monitoring screens current: each change refetches the queue and the event it names.
 * Returns the stream's state for the "live" / "reconnecting" indicator.
 */
export function useMonitoringStream(): StreamState {
  const queryClient = useQueryClient();

  useEffect(() => {
    const changedEvents = new Set<string>();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const flush = () => {
      timer = undefined;
      void queryClient.invalidateQueries({ queryKey: monitoringQueryKeys.lists() });
      for (const eventId of changedEvents) {
        void queryClient.invalidateQueries({ queryKey: monitoringQueryKeys.detail(eventId) });
      }
      changedEvents.clear();
    };
    const remove = stream.add({
      onChange: (change) => {
        if (change.eventId) changedEvents.add(change.eventId);
        timer ??= setTimeout(flush, COALESCE_MS);
      },
      onResume: () => void queryClient.invalidateQueries({ queryKey: monitoringQueryKeys.all }),
    });
    return () => {
      clearTimeout(timer);
      remove();
    };
  }, [queryClient]);

  return useSyncExternalStore(
    (onStateChange) => stream.subscribeToState(onStateChange),
    () => stream.state,
    () => 'connecting' as const,
  );
}
