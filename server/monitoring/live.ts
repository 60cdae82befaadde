import type { Knex } from 'knex';
import type { Notification, Client } from 'pg';
import type { Logger } from 'pino';
import { SIGNALS_CHANNEL } from './channel';

export interface LiveChange {
  eventId: string | null;
  signalId?: string;
}

type Listener = (change: LiveChange) => void;

/**
 * PostgreSQL LISTEN/NOTIFY fanned out to the operators' open streams. Every change to the queue
 * is NOTIFYed in the transaction that makes it, so any API process sees every change, whichever
 * process (or the receiver) made it. The LISTEN connection is held only while someone watches.
 */
export function createLiveFeed(db: Knex, logger: Logger) {
  const listeners = new Set<Listener>();
  let connection: Promise<Client> | null = null;

  const onNotification = (message: Notification) => {
    if (message.channel !== SIGNALS_CHANNEL || !message.payload) return;
    let change: LiveChange;
    try {
      change = JSON.parse(message.payload) as LiveChange;
    } catch {
      return;
    }
    for (const listener of listeners) listener(change);
  };

  async function open(): Promise<Client> {
    const client = (await db.client.acquireConnection()) as Client;
    client.on('notification', onNotification);
    await client.query(`listen ${SIGNALS_CHANNEL}`);
    return client;
  }

  async function close(pending: Promise<Client>) {
    try {
      const client = await pending;
      client.removeListener('notification', onNotification);
      await client.query(`unlisten ${SIGNALS_CHANNEL}`);
      await db.client.releaseConnection(client);
    } catch (error) {
      logger.warn({ err: error }, 'closing the live feed connection failed');
    }
  }

  return {
    subscribe(listener: Listener): () => void {
      listeners.add(listener);
      if (!connection) {
        connection = open();
        connection.catch((error: unknown) => {
          logger.error({ err: error }, 'the live feed could not listen');
          connection = null;
        });
      }
      return () => {
        listeners.delete(listener);
        if (listeners.size === 0 && connection) {
          const pending = connection;
          connection = null;
          void close(pending);
        }
      };
    },
  };
}

export type LiveFeed = ReturnType<typeof createLiveFeed>;

/** Sends a change to every listening process; call inside the transaction making the change. */
export async function notifyChange(trx: Knex, change: LiveChange) {
  await trx.raw('select pg_notify(?, ?)', [SIGNALS_CHANNEL, JSON.stringify(change)]);
}
