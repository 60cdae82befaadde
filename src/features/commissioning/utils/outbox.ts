import {
  sendCommissioningRecord,
  type RecordKind,
  type RecordReply,
} from '@/features/commissioning/api/send-commissioning-record';
import { ApiError, NetworkError } from '@/lib/api-client';

/*
 * The outbox: commissioning records saved on the phone while there is no connection, kept in
 * localStorage per site and sent when the connection is back. Every record carries the key made
 * on the phone when it was saved, and the API treats a repeated key as the same record, so
 * sending one twice (a reply lost on the way back) is harmless.
 */

export type OutboxEntry = {
  clientKey: string;
  kind: RecordKind;
  /** The request body exactly as it will be sent, key and on-site time included. */
  body: Record<string, unknown>;
  /** What the record is, in words: "Walk test of zone 3 (Hall)". */
  label: string;
  zoneId: string | null;
  /** For system tests: sounders, signalling or battery. */
  testKind: string | null;
  queuedAt: string;
  /** Set when the API refused it on resending: it will not go through as it stands. */
  refusal?: string;
};

/**
 * Whose records, for which site. Records are kept per signed-in person as well as per site, so
 * a shared phone never sends one engineer's tests under another's name.
 */
export type OutboxScope = { userId: string; siteId: string };

const STORAGE_PREFIX = 'wardbook:commissioning-outbox:';
const storageKey = ({ userId, siteId }: OutboxScope) => `${STORAGE_PREFIX}${userId}:${siteId}`;

// Parsed copies, so every reader gets the same array until the outbox changes (React's
// useSyncExternalStore needs a stable snapshot).
const snapshots = new Map<string, OutboxEntry[]>();
const listeners = new Set<() => void>();
let storageRefused = false;

const EMPTY: OutboxEntry[] = [];

function notify() {
  for (const listener of listeners) listener();
}

function isEntry(value: unknown): value is OutboxEntry {
  if (!value || typeof value !== 'object') return false;
  const entry = value as Partial<OutboxEntry>;
  return (
    typeof entry.clientKey === 'string' &&
    typeof entry.kind === 'string' &&
    typeof entry.body === 'object' &&
    entry.body !== null
  );
}

export function outboxEntries(scope: OutboxScope): OutboxEntry[] {
  const key = storageKey(scope);
  const cached = snapshots.get(key);
  if (cached) return cached;
  let entries: OutboxEntry[] = EMPTY;
  try {
    const stored = window.localStorage.getItem(key);
    if (stored) {
      const parsed: unknown = JSON.parse(stored);
      if (Array.isArray(parsed)) entries = parsed.filter(isEntry);
    }
  } catch {
    // Unreadable or blocked storage: nothing waiting that this page can see.
  }
  snapshots.set(key, entries);
  return entries;
}

function writeOutbox(scope: OutboxScope, entries: OutboxEntry[]) {
  const key = storageKey(scope);
  snapshots.set(key, entries.length === 0 ? EMPTY : entries);
  try {
    if (entries.length === 0) window.localStorage.removeItem(key);
    else window.localStorage.setItem(key, JSON.stringify(entries));
    storageRefused = false;
  } catch (error) {
    // Storage full or switched off: the records stay in this page's memory only.
    storageRefused = true;
    console.warn('Could not keep commissioning records on this device', error);
  }
  notify();
}

/** True when the browser refused to store the outbox, so records live only while the page is open. */
export function isOutboxStorageRefused(): boolean {
  return storageRefused;
}

/** Every site where this person has records waiting on this phone. */
export function scopesWithWaiting(userId: string): OutboxScope[] {
  const prefix = `${STORAGE_PREFIX}${userId}:`;
  const scopes: OutboxScope[] = [];
  try {
    for (let index = 0; index < window.localStorage.length; index++) {
      const key = window.localStorage.key(index);
      if (!key?.startsWith(prefix)) continue;
      const scope = { userId, siteId: key.slice(prefix.length) };
      if (outboxEntries(scope).some((entry) => !entry.refusal)) scopes.push(scope);
    }
  } catch {
    // Storage blocked: nothing kept to send.
  }
  return scopes;
}

export function subscribeToOutbox(listener: () => void): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

// Another tab on the same phone may send or add records.
if (typeof window !== 'undefined') {
  window.addEventListener('storage', (event) => {
    if (event.key === null || event.key.startsWith(STORAGE_PREFIX)) {
      snapshots.clear();
      notify();
    }
  });
}

export function addToOutbox(scope: OutboxScope, entry: OutboxEntry): void {
  const entries = outboxEntries(scope).filter((item) => item.clientKey !== entry.clientKey);
  writeOutbox(scope, [...entries, entry]);
}

export function removeFromOutbox(scope: OutboxScope, clientKey: string): void {
  writeOutbox(
    scope,
    outboxEntries(scope).filter((entry) => entry.clientKey !== clientKey),
  );
}

function markRefused(scope: OutboxScope, clientKey: string, refusal: string): void {
  writeOutbox(
    scope,
    outboxEntries(scope).map((entry) =>
      entry.clientKey === clientKey ? { ...entry, refusal } : entry,
    ),
  );
}

/**
 * Whether a failed send is worth trying again later: no connection, the server down or busy,
 * or the session ended (the record waits until the engineer signs in again). A refusal of the
 * record itself (400, 403, 404, 409) will not change by resending.
 */
export function isWorthResending(error: unknown): boolean {
  if (error instanceof NetworkError) return true;
  if (!(error instanceof ApiError)) return false;
  return (
    isSessionProblem(error) || error.status === 408 || error.status === 429 || error.status >= 500
  );
}

/**
 * The session ended (401), or this page's security token belongs to a session that has (the
 * API checks the token first, so an expired session shows as a failed security check).
 */
export function isSessionProblem(error: unknown): boolean {
  return (
    error instanceof ApiError &&
    (error.status === 401 || (error.status === 403 && error.type.endsWith('/csrf')))
  );
}

/** A 2xx reply this page could not read: the API has the record all the same. */
export function wasDelivered(error: unknown): boolean {
  return error instanceof ApiError && error.status >= 200 && error.status < 300;
}

function refusalMessage(error: unknown): string {
  if (error instanceof ApiError) {
    const details = error.fieldErrors.map((fieldError) => fieldError.message);
    return [error.title, ...details].join(' ');
  }
  return 'Wardbook could not accept this record.';
}

export type FlushResult = {
  sent: number;
  refused: number;
  /** Why sending stopped with records still waiting, when it did. */
  stoppedBy: unknown;
};

const flushing = new Map<string, Promise<FlushResult>>();

async function sendWaiting(scope: OutboxScope): Promise<FlushResult> {
  const result: FlushResult = { sent: 0, refused: 0, stoppedBy: null };
  // Oldest first, so the API sees tests in the order they were done.
  for (const entry of outboxEntries(scope).filter((item) => !item.refusal)) {
    try {
      await sendCommissioningRecord(scope.siteId, entry.kind, entry.body);
      removeFromOutbox(scope, entry.clientKey);
      result.sent += 1;
    } catch (error) {
      if (wasDelivered(error)) {
        removeFromOutbox(scope, entry.clientKey);
        result.sent += 1;
      } else if (isWorthResending(error)) {
        result.stoppedBy = error;
        break;
      } else {
        markRefused(scope, entry.clientKey, refusalMessage(error));
        result.refused += 1;
      }
    }
  }
  return result;
}

/** Sends what is waiting, oldest first; one run per outbox at a time. */
export function flushOutbox(scope: OutboxScope): Promise<FlushResult> {
  const key = storageKey(scope);
  const running = flushing.get(key);
  if (running) return running;
  const run = sendWaiting(scope).finally(() => flushing.delete(key));
  flushing.set(key, run);
  return run;
}

export type SubmitOutcome =
  { outcome: 'sent'; reply: RecordReply | null } | { outcome: 'kept-on-phone'; because: unknown };

/**
 * Sends a record now. If the connection (or the server) fails, it is kept in the outbox and
 * sent later; if the API refuses it, the error is thrown for the form to show beside its fields.
 */
export async function submitRecord(scope: OutboxScope, entry: OutboxEntry): Promise<SubmitOutcome> {
  try {
    return {
      outcome: 'sent',
      reply: await sendCommissioningRecord(scope.siteId, entry.kind, entry.body),
    };
  } catch (error) {
    if (wasDelivered(error)) return { outcome: 'sent', reply: null };
    if (!isWorthResending(error)) throw error;
    addToOutbox(scope, entry);
    return { outcome: 'kept-on-phone', because: error };
  }
}

/**
 * A record key made on the phone: a version 4 UUID. crypto.randomUUID needs a secure context,
 * so outside one the same 122 random bits are drawn with getRandomValues.
 */
export function newClientKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  bytes[6] = (bytes[6]! & 0x0f) | 0x40;
  bytes[8] = (bytes[8]! & 0x3f) | 0x80;
  const hex = [...bytes].map((byte) => byte.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}
