import type { Knex } from 'knex';
import { startAutomaticCallOut } from './callout/service';
import { noteSignalAfterMissedTest } from './missed-test-restore';
import type { SignalCategory } from './protocol/contact-id';
import type { IncomingSignal } from './repository';

/**
 * Turning signals into the events operators handle. Hold-up and fire come first, then a
 * confirmed intruder alarm, then an unconfirmed one, then tamper and faults.
 */
export const PRIORITY: Record<EventCategory | 'burglary_confirmed', number> = {
  hold_up: 1,
  fire: 1,
  burglary_confirmed: 2,
  burglary: 3,
  tamper: 4,
  fault: 5,
  other: 6,
};

export type EventCategory = Exclude<SignalCategory, 'test' | 'open_close'>;

const CATEGORY_WORDS: Record<EventCategory, string> = {
  fire: 'Fire alarm',
  hold_up: 'Hold-up alarm',
  burglary: 'Intruder alarm',
  tamper: 'Tamper',
  fault: 'Fault',
  other: 'Signal',
};

/** BS 8243's window is the site's setting, 30 to 60 minutes; unknown accounts use the shortest. */
const DEFAULT_WINDOW_MINUTES = 30;

interface OpenEvent {
  id: string;
  zones: number[];
  confirmed: boolean;
  first_signal_at: Date;
}

async function addToTimeline(trx: Knex, eventId: string, kind: string, text: string) {
  await trx('event_timeline').insert({ event_id: eventId, kind, text });
}

const zoneWords = (zone: number | null) => (zone === null ? '' : ` on zone ${zone}`);

/**
 * Files one signal (already known to be new, not a resend) against the site's events, inside
 * the caller's transaction. Returns the event it opened, joined or restored, if any.
 */
export async function fileSignal(
  trx: Knex,
  signal: IncomingSignal,
  siteId: string | null,
): Promise<string | null> {
  // Any signal shows the path works: an open missed-test fault is marked restored.
  const pathRestored = siteId
    ? await noteSignalAfterMissedTest(trx, siteId, signal.category)
    : null;
  if (signal.category === 'test' || signal.category === 'open_close') return pathRestored;
  const category = signal.category as EventCategory;
  const zone = signal.zoneOrUser;

  if (signal.qualifier === 'restore') {
    const restored = await trx('alarm_events')
      .where({ account: signal.account, category, raised_by_missed_test: false })
      .whereNot({ status: 'closed' })
      .whereNull('restored_at')
      .modify((query) => {
        if (zone !== null) query.whereRaw('? = any(zones)', [zone]);
      })
      .orderBy('first_signal_at', 'desc')
      .first('id');
    if (!restored) return null;
    await trx('alarm_events')
      .where({ id: restored.id })
      .update({ restored_at: trx.fn.now(), last_signal_at: trx.fn.now() });
    await addToTimeline(trx, restored.id, 'restored', `Restored${zoneWords(zone)}.`);
    return restored.id;
  }

  const site = siteId
    ? await trx('sites').where({ id: siteId }).first('confirmation_window_minutes')
    : undefined;
  const windowMinutes = Number(site?.confirmation_window_minutes ?? DEFAULT_WINDOW_MINUTES);
  const open: OpenEvent | undefined = await trx('alarm_events')
    .where({ account: signal.account, category, raised_by_missed_test: false })
    .whereNot({ status: 'closed' })
    .where('first_signal_at', '>', trx.raw(`now() - make_interval(mins => ?)`, [windowMinutes]))
    .orderBy('first_signal_at', 'desc')
    .forUpdate()
    .first('id', 'zones', 'confirmed', 'first_signal_at');

  if (open) {
    const newZone = zone !== null && !open.zones.includes(zone);
    const confirming = category === 'burglary' && newZone && !open.confirmed;
    await trx('alarm_events')
      .where({ id: open.id })
      .update({
        last_signal_at: trx.fn.now(),
        ...(newZone ? { zones: trx.raw('array_append(zones, ?)', [zone]) } : {}),
        ...(confirming
          ? { confirmed: true, confirmed_at: trx.fn.now(), priority: PRIORITY.burglary_confirmed }
          : {}),
      });
    if (confirming) {
      await addToTimeline(
        trx,
        open.id,
        'confirmed',
        `Confirmed: zone ${zone} after zone ${open.zones.join(', ')}, within the site's ${windowMinutes}-minute window (sequential confirmation, BS 8243).`,
      );
    } else {
      await addToTimeline(
        trx,
        open.id,
        'signal',
        `${CATEGORY_WORDS[category]} again${zoneWords(zone)}.`,
      );
    }
    return open.id;
  }

  const [created] = await trx('alarm_events')
    .insert({
      site_id: siteId,
      account: signal.account,
      category,
      priority: PRIORITY[category],
      zones: zone === null ? [] : [zone],
      first_signal_at: trx.fn.now(),
      last_signal_at: trx.fn.now(),
    })
    .returning<{ id: string }[]>('id');
  await addToTimeline(
    trx,
    created!.id,
    'received',
    `${CATEGORY_WORDS[category]}${zoneWords(zone)}, account ${signal.account}${siteId ? '' : ' (no site has this account: check it)'}.`,
  );
  // Centres that choose to text keyholders at once do so in this same transaction (outbox).
  if (siteId) await startAutomaticCallOut(trx, created!.id);
  return created!.id;
}
