import type { Knex } from 'knex';
import { SIGNALS_CHANNEL } from './channel';
import { fileSignal } from './events';
import type { Qualifier, SignalCategory } from './protocol/contact-id';

export interface IncomingSignal {
  transport: 'dc09_tcp' | 'https';
  protocol: string;
  account: string;
  sequence: string;
  receiver: string | null;
  linePrefix: string | null;
  data: string;
  wasEncrypted: boolean;
  panelTime: Date | null;
  raw: string;
  eventCode: string | null;
  category: SignalCategory;
  qualifier: Qualifier;
  zoneOrUser: number | null;
  partition: number | null;
}

/**
 * Panels resend a frame they have no ACK for, with the same sequence number. A resend inside this
 * window is the same signal; sequence numbers wrap at 9999, so an old match is a new signal.
 */
export const DUPLICATE_WINDOW_MINUTES = 10;

export { SIGNALS_CHANNEL };

/**
 * Stores a signal once and commits before returning, so the caller may acknowledge it. A resend
 * (same account, sequence and data within the window) is not stored again. Signals for accounts
 * no site holds are kept, flagged, for the operator to resolve.
 */
export async function recordSignal(
  db: Knex,
  signal: IncomingSignal,
): Promise<{ id: string; duplicate: boolean; siteId: string | null }> {
  return db.transaction(async (trx) => {
    // One account's frames are recorded one at a time, so two copies arriving together meet.
    await trx.raw('select pg_advisory_xact_lock(hashtext(?))', [`signal:${signal.account}`]);
    const previous = await trx('signals')
      .where({ account: signal.account, sequence: signal.sequence, data: signal.data })
      .where('received_at', '>', trx.raw(`now() - interval '${DUPLICATE_WINDOW_MINUTES} minutes'`))
      .first('id', 'site_id');
    if (previous) return { id: String(previous.id), duplicate: true, siteId: previous.site_id };
    const sites = await trx('sites')
      .whereNotNull('monitoring_centre_id')
      .where({ monitoring_account: signal.account })
      .pluck('id');
    // An account two centres both use cannot be placed safely: flagged like an unknown one.
    const siteId = sites.length === 1 ? (sites[0] as string) : null;
    const eventId = await fileSignal(trx, signal, siteId);
    const [row] = await trx('signals')
      .insert({
        transport: signal.transport,
        protocol: signal.protocol,
        account: signal.account,
        sequence: signal.sequence,
        receiver: signal.receiver,
        line_prefix: signal.linePrefix,
        data: signal.data,
        was_encrypted: signal.wasEncrypted,
        panel_time: signal.panelTime,
        raw: signal.raw,
        site_id: siteId,
        unknown_account: siteId === null,
        event_code: signal.eventCode,
        category: signal.category,
        qualifier: signal.qualifier,
        zone_or_user: signal.zoneOrUser,
        partition: signal.partition,
        event_id: eventId,
      })
      .returning<{ id: string }[]>('id');
    await trx.raw('select pg_notify(?, ?)', [
      SIGNALS_CHANNEL,
      JSON.stringify({ eventId, signalId: String(row!.id) }),
    ]);
    return { id: String(row!.id), duplicate: false, siteId };
  });
}
