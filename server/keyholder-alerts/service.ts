import type { Knex } from 'knex';
import { ConflictError, NotFoundError } from '../http/errors';
import { recordKeyholderReply } from '../monitoring/callout/service';
import type { KeyholderAlert } from './schema';

/**
 * The alarms a keyholder has been asked to attend: those where a text went to them. Each row
 * carries their newest message for the event, so their answer is the one shown.
 */
function alertsOf(db: Knex, userId: string) {
  return db('keyholder_messages as m')
    .join('keyholders as k', 'k.id', 'm.keyholder_id')
    .join('alarm_events as e', 'e.id', 'm.event_id')
    .join('sites as s', 's.id', 'e.site_id')
    .where('k.user_id', userId)
    .whereNotExists(function newerMessageToSameKeyholder() {
      this.select(db.raw('1'))
        .from('keyholder_messages as newer')
        .whereRaw('newer.event_id = m.event_id')
        .whereRaw('newer.keyholder_id = m.keyholder_id')
        .whereRaw('newer.queued_at > m.queued_at');
    })
    .select(
      'm.id as message_id',
      'm.reply',
      'm.replied_at',
      'e.id as event_id',
      'e.category',
      'e.confirmed',
      'e.first_signal_at',
      'e.callout_status',
      'e.status',
      'e.closed_at',
      'e.outcome',
      's.name as site_name',
      's.address_line1',
      's.address_line2',
      's.town',
      's.postcode',
    );
}

function toAlert(row: Record<string, unknown>): KeyholderAlert {
  const iso = (value: unknown) => (value instanceof Date ? value.toISOString() : null);
  return {
    eventId: row.event_id as string,
    siteName: row.site_name as string,
    town: row.town as string,
    address: [row.address_line1, row.address_line2, row.town, row.postcode].filter(
      Boolean,
    ) as string[],
    category: row.category as string,
    confirmed: row.confirmed as boolean,
    raisedAt: iso(row.first_signal_at)!,
    callOutStatus: row.callout_status as string,
    myResponse: (row.reply as KeyholderAlert['myResponse']) ?? null,
    respondedAt: iso(row.replied_at),
    closedAt: iso(row.closed_at),
    outcome: (row.outcome as string | null) ?? null,
  };
}

export async function keyholderAlerts(db: Knex, userId: string) {
  const [active, past] = await Promise.all([
    alertsOf(db, userId).whereNot('e.status', 'closed').orderBy('e.first_signal_at', 'desc'),
    alertsOf(db, userId).where('e.status', 'closed').orderBy('e.first_signal_at', 'desc').limit(25),
  ]);
  return { active: active.map(toAlert), past: past.map(toAlert) };
}

/** Answering in the app counts the same as replying 1 or 2 to the text. */
export async function respondToAlert(
  db: Knex,
  userId: string,
  eventId: string,
  response: 'attending' | 'cannot_attend',
) {
  const row = await alertsOf(db, userId).where('e.id', eventId).first();
  if (!row) throw new NotFoundError();
  if (row.status === 'closed') throw new ConflictError('This alarm has been dealt with already.');
  const outcome = await db.transaction((trx) =>
    recordKeyholderReply(trx, row.message_id as string, response, 'app'),
  );
  const updated = await alertsOf(db, userId).where('e.id', eventId).first();
  return { alert: toAlert(updated), moveOn: outcome.moveOn };
}
