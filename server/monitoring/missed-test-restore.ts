import type { Knex } from 'knex';
import type { SignalCategory } from './protocol/contact-id';

// Apart from missed-tests.ts so that events.ts, which files every signal, can call it without
// importing the sweep (which imports events.ts for its priorities).

/**
 * Called as each new signal is filed: a signal from a site with an open missed-test fault shows
 * the path works again, so the fault is marked restored with a note. Returns that event's id.
 */
export async function noteSignalAfterMissedTest(
  trx: Knex,
  siteId: string,
  category: SignalCategory,
): Promise<string | null> {
  const open = await trx('alarm_events')
    .where({ site_id: siteId, raised_by_missed_test: true })
    .whereNot({ status: 'closed' })
    .whereNull('restored_at')
    .forUpdate()
    .first('id');
  if (!open) return null;
  await trx('alarm_events')
    .where({ id: open.id })
    .update({ restored_at: trx.fn.now(), last_signal_at: trx.fn.now() });
  await trx('event_timeline').insert({
    event_id: open.id,
    kind: 'restored',
    text:
      category === 'test'
        ? 'Periodic test received again.'
        : 'A signal came through, so the signalling path works again; the periodic test is still to come.',
  });
  return open.id as string;
}
