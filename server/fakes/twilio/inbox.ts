import { randomBytes } from 'node:crypto';
import { Waiters } from '../waiters';

export type MessageDirection = 'outbound' | 'inbound';

/** The statuses the fake moves a message through (a subset of Twilio's). */
export type MessageStatus = 'queued' | 'sent' | 'delivered' | 'received';

/** One webhook the fake posted about a message: a status callback or the inbound reply. */
export interface WebhookAttempt {
  url: string;
  /** What the message's status was when this was posted. */
  status: MessageStatus;
  at: string;
  /** The receiver's HTTP status, or the network error when it could not be reached. */
  responseStatus: number | null;
  error: string | null;
}

export interface StoredMessage {
  sid: string;
  accountSid: string;
  messagingServiceSid: string | null;
  from: string;
  to: string;
  body: string;
  numSegments: number;
  status: MessageStatus;
  direction: MessageDirection;
  dateCreated: string;
  dateUpdated: string;
  dateSent: string | null;
  statusCallback: string | null;
  webhooks: WebhookAttempt[];
}

const KEEP = 1000;

/** Twilio's message SIDs are "SM" and 32 hex digits. */
export function newMessageSid(): string {
  return `SM${randomBytes(16).toString('hex')}`;
}

/**
 * The fake's memory of every SMS it has "sent" or "received": newest 1,000 kept, read by the
 * web page, the JSON API and tests (which can wait for a message to arrive).
 */
export class Inbox {
  private messages: StoredMessage[] = [];
  private waiters = new Waiters();

  /** Newest first. */
  list(): StoredMessage[] {
    return [...this.messages].reverse();
  }

  get(sid: string): StoredMessage | undefined {
    return this.messages.find((message) => message.sid === sid);
  }

  clear() {
    this.messages = [];
  }

  add(
    message: Omit<StoredMessage, 'sid' | 'dateCreated' | 'dateUpdated' | 'dateSent' | 'webhooks'>,
  ): StoredMessage {
    const now = new Date().toISOString();
    const stored: StoredMessage = {
      ...message,
      sid: newMessageSid(),
      dateCreated: now,
      dateUpdated: now,
      dateSent: message.direction === 'inbound' ? now : null,
      webhooks: [],
    };
    this.messages.push(stored);
    if (this.messages.length > KEEP) this.messages.splice(0, this.messages.length - KEEP);
    this.waiters.wake();
    return stored;
  }

  setStatus(sid: string, status: MessageStatus) {
    const message = this.get(sid);
    if (!message) return;
    const now = new Date().toISOString();
    message.status = status;
    message.dateUpdated = now;
    if (status === 'sent') message.dateSent = now;
    this.waiters.wake();
  }

  recordWebhook(sid: string, attempt: WebhookAttempt) {
    this.get(sid)?.webhooks.push(attempt);
    this.waiters.wake();
  }

  /** Resolves with the first message matching the predicate, waiting for it if needed. */
  waitFor(predicate: (item: StoredMessage) => boolean, timeoutMs = 10_000): Promise<StoredMessage> {
    return this.waiters.waitFor(() => this.messages.find(predicate), timeoutMs, 'SMS');
  }
}
