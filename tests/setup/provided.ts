import type { DatabaseConnection } from '../../server/db/knex';

export interface StackUrls {
  apiUrl: string;
  idpUrl: string;
  mailUrl: string;
  /** The Twilio fake's page and API. */
  smsUrl: string;
}

declare module 'vitest' {
  export interface ProvidedContext {
    database: DatabaseConnection;
    stack: StackUrls;
  }
}
