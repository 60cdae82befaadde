import type { Knex } from 'knex';
import { describeSignal } from '../monitoring/describe';
import { reinstatement } from '../calc/reinstatement';
import { FALSE_OUTCOMES, siteFalseAlarms } from '../monitoring/service';
import { PRIME_CAUSE_LABELS, type PrimeCause } from '../service/schema';
import { ukDateOf } from '../service/service';

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

/**
 * The site's false alarms over the rolling 12 months, with each event, the call-outs that found
 * a false alarm's cause, and what reinstating police response would take, for the installer.
 */
export async function falseAlarmRecord(db: Knex, siteId: string, now = new Date()) {
  const [standing, events, lastFalseAlarm, visits, site] = await Promise.all([
    siteFalseAlarms(db, siteId, now),
    db('alarm_events')
      .where({ site_id: siteId, status: 'closed' })
      .whereIn('outcome', FALSE_OUTCOMES)
      .where('first_signal_at', '>', db.raw("now() - interval '12 months'"))
      .orderBy('first_signal_at', 'desc')
      .select('id', 'first_signal_at', 'category', 'outcome', 'closed_at'),
    // The three clear months run from the latest false alarm, however old.
    db('alarm_events')
      .where({ site_id: siteId, status: 'closed' })
      .whereIn('outcome', FALSE_OUTCOMES)
      .max<{ at: Date | null }>('first_signal_at as at')
      .first(),
    db('service_visits as v')
      .leftJoin('users as u', 'u.id', 'v.engineer_id')
      .where({ 'v.site_id': siteId, 'v.kind': 'corrective', 'v.status': 'done' })
      .where('v.false_alarm', true)
      .where('v.completed_at', '>', db.raw("now() - interval '12 months'"))
      .orderBy('v.completed_at', 'desc')
      .select<FalseAlarmVisitRow[]>(
        'v.id',
        'v.completed_at',
        'v.prime_cause',
        'v.false_alarm_cause',
        'v.action_taken',
        'u.display_name as engineer_name',
      ),
    db('sites').where({ id: siteId }).first<{ urn_status: string }>('urn_status'),
  ]);
  const correctiveVisits = visits.map((visit) => ({
    id: visit.id,
    completedAt: visit.completed_at.toISOString(),
    primeCause: visit.prime_cause as PrimeCause,
    primeCauseLabel: PRIME_CAUSE_LABELS[visit.prime_cause as PrimeCause] ?? '',
    falseAlarmCause: visit.false_alarm_cause ?? '',
    actionTaken: visit.action_taken ?? '',
    engineerName: visit.engineer_name,
  }));
  return {
    ...standing,
    events: events.map((event: Record<string, unknown>) => ({
      id: event.id as string,
      at: (event.first_signal_at as Date).toISOString(),
      category: event.category as string,
      outcome: event.outcome as string,
      closedAt: (event.closed_at as Date).toISOString(),
    })),
    correctiveVisits,
    reinstatement: {
      // Reinstatement matters once response is withdrawn, or about to be (NPCC policy).
      needed: site?.urn_status === 'withdrawn' || standing.standing === 'withdrawal_due',
      ...reinstatement({
        falseAlarmDates: lastFalseAlarm?.at ? [ukDateOf(lastFalseAlarm.at)] : [],
        remedialVisits: visits.map((visit) => ({
          id: visit.id,
          doneOn: ukDateOf(visit.completed_at),
          cause: visit.false_alarm_cause ?? '',
          actionTaken: visit.action_taken ?? '',
        })),
        today: ukDateOf(now),
      }),
    },
  };
}

interface FalseAlarmVisitRow {
  id: string;
  completed_at: Date;
  prime_cause: string | null;
  false_alarm_cause: string | null;
  action_taken: string | null;
  engineer_name: string | null;
}
