import type { Knex } from 'knex';
import { describeSignal } from '../monitoring/describe';
import { FALSE_OUTCOMES, siteFalseAlarms } from '../monitoring/service';

const PAGE_SIZE = 50;

/** The signals a site's panel has sent, newest first, a page at a time. */
export async function signalHistory(db: Knex, siteId: string, before: string | null) {
  const rows = await db('signals as g')
    .leftJoin('systems as y', 'y.site_id', 'g.site_id')
    .leftJoin('zones as z', function zoneOfSignal() {
      this.on('z.system_id', '=', 'y.id')
        .andOn('z.number', '=', 'g.zone_or_user')
        .andOnVal('g.category', '<>', 'open_close');
    })
    .where('g.site_id', siteId)
    .modify((query) => {
      if (before) query.where('g.id', '<', before);
    })
    .orderBy('g.id', 'desc')
    .limit(PAGE_SIZE + 1)
    .select(
      'g.id',
      'g.received_at',
      'g.category',
      'g.qualifier',
      'g.event_code',
      'g.zone_or_user',
      'z.location as zone_name',
    );
  const page = rows.slice(0, PAGE_SIZE);
  return {
    signals: page.map((row: Record<string, unknown>) => ({
      id: String(row.id),
      at: (row.received_at as Date).toISOString(),
      category: row.category as string,
      qualifier: row.qualifier as string,
      description: describeSignal({
        category: row.category as string,
        qualifier: row.qualifier as string,
        eventCode: (row.event_code as string | null) ?? null,
        zoneOrUser: (row.zone_or_user as number | null) ?? null,
      }),
      zone: row.category === 'open_close' ? null : ((row.zone_or_user as number | null) ?? null),
      zoneName: (row.zone_name as string | null) ?? null,
    })),
    nextBefore: rows.length > PAGE_SIZE ? String(page[page.length - 1]!.id) : null,
    falseAlarms: await siteFalseAlarms(db, siteId),
  };
}

/** The site's false alarms over the rolling 12 months, with each event, for the installer. */
export async function falseAlarmRecord(db: Knex, siteId: string) {
  const [standing, events] = await Promise.all([
    siteFalseAlarms(db, siteId),
    db('alarm_events')
      .where({ site_id: siteId, status: 'closed' })
      .whereIn('outcome', FALSE_OUTCOMES)
      .where('first_signal_at', '>', db.raw("now() - interval '12 months'"))
      .orderBy('first_signal_at', 'desc')
      .select('id', 'first_signal_at', 'category', 'outcome', 'closed_at'),
  ]);
  return {
    ...standing,
    events: events.map((event: Record<string, unknown>) => ({
      id: event.id as string,
      at: (event.first_signal_at as Date).toISOString(),
      category: event.category as string,
      outcome: event.outcome as string,
      closedAt: (event.closed_at as Date).toISOString(),
    })),
  };
}
