/** The PostgreSQL NOTIFY channel every change to signals and events is announced on. */
export const SIGNALS_CHANNEL = 'wardbook_signals';
