import type { Knex } from 'knex';
import { recordAuditEntry, type AuditEntryInput } from '../audit/repository';
import { countFalseAlarms, policeEligibility } from '../calc/police-response';
import { ConflictError, NotFoundError } from '../http/errors';
import type { AlarmEvent, Outcome } from './schema';
import { notifyChange } from './live';
import { OUTCOME_LABELS } from './schema';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Events an operator may see: their centre's sites, and signals from accounts no site holds. */
function eventsFor(db: Knex, centreIds: string[]) {
  return db('alarm_events as e')
    .leftJoin('sites as s', 's.id', 'e.site_id')
    .leftJoin('users as u', 'u.id', 'e.taken_by')
    .where((scope) => scope.whereIn('s.monitoring_centre_id', centreIds).orWhereNull('e.site_id'))
    .select(
      'e.*',
      's.name as site_name',
      's.reference as site_reference',
      'u.display_name as taken_by_name',
    );
}

function toEvent(row: Record<string, unknown>): AlarmEvent {
  const iso = (value: unknown) => (value instanceof Date ? value.toISOString() : null);
  return {
    id: row.id as string,
    siteId: (row.site_id as string | null) ?? null,
    siteName: (row.site_name as string | null) ?? null,
    siteReference: (row.site_reference as string | null) ?? null,
    account: row.account as string,
    category: row.category as string,
    priority: row.priority as number,
    status: row.status as AlarmEvent['status'],
    confirmed: row.confirmed as boolean,
    zones: row.zones as number[],
    firstSignalAt: iso(row.first_signal_at)!,
    lastSignalAt: iso(row.last_signal_at)!,
    restoredAt: iso(row.restored_at),
    takenBy: (row.taken_by_name as string | null) ?? null,
    takenById: (row.taken_by as string | null) ?? null,
    closedAt: iso(row.closed_at),
    outcome: (row.outcome as string | null) ?? null,
  };
}

/** Whether an event is one this operator's centres may see (or an unplaced one). */
export async function eventVisibleTo(db: Knex, centreIds: string[], eventId: string) {
  return Boolean(await eventsFor(db, centreIds).where('e.id', eventId).first('e.id'));
}

/** The live queue: highest priority first, then the oldest. */
export async function listEvents(db: Knex, centreIds: string[], status: 'active' | 'closed') {
  const rows = await eventsFor(db, centreIds)
    .modify((query) => {
      if (status === 'active') query.whereIn('e.status', ['open', 'taken']);
      else query.where('e.status', 'closed').orderBy('e.closed_at', 'desc').limit(100);
    })
    .orderBy([
      { column: 'e.priority', order: 'asc' },
      { column: 'e.first_signal_at', order: 'asc' },
    ]);
  return rows.map(toEvent);
}

export async function findEvent(db: Knex, centreIds: string[], eventId: string) {
  if (!UUID.test(eventId)) throw new NotFoundError();
  const row = await eventsFor(db, centreIds).where('e.id', eventId).first();
  if (!row) throw new NotFoundError();
  return row as Record<string, unknown>;
}

export const FALSE_OUTCOMES = [
  'false_alarm_user',
  'false_alarm_equipment',
  'false_alarm_environment',
  'false_alarm_unknown',
];

/** The site's false alarms in the last twelve months and what they mean for police response. */
export async function siteFalseAlarms(db: Knex, siteId: string, now = new Date()) {
  const times: Date[] = await db('alarm_events')
    .where({ site_id: siteId, status: 'closed' })
    .whereIn('outcome', FALSE_OUTCOMES)
    .where('first_signal_at', '>', db.raw("now() - interval '13 months'"))
    .pluck('first_signal_at');
  const result = countFalseAlarms(times, now);
  return {
    count: result.count,
    standing: result.standing,
    oldestDropsOffAt: result.oldestDropsOffAt?.toISOString() ?? null,
  };
}

/** One event with what the operator needs beside it: the site panel and the timeline. */
export async function eventDetail(db: Knex, centreIds: string[], eventId: string) {
  const row = await findEvent(db, centreIds, eventId);
  const siteId = row.site_id as string | null;
  const [timeline, site, keyholders, recent] = await Promise.all([
    db('event_timeline as t')
      .leftJoin('users as u', 'u.id', 't.actor_user_id')
      .where('t.event_id', eventId)
      .orderBy('t.id')
      .select('t.at', 't.kind', 't.text', 'u.display_name as actor'),
    siteId
      ? db('sites')
          .where({ id: siteId })
          .first(
            'name',
            'reference',
            'address_line1',
            'address_line2',
            'town',
            'postcode',
            'hazards',
            'access_notes',
            'police_urn',
            'urn_status',
            'confirmation_window_minutes',
            'monitoring_centre_id',
          )
      : undefined,
    siteId
      ? db('keyholders')
          .where({ site_id: siteId })
          .orderBy('call_order')
          .select('call_order', 'name', 'phone', 'minutes_to_attend')
      : [],
    siteId
      ? db('alarm_events')
          .where({ site_id: siteId })
          .whereNot({ id: eventId })
          .orderBy('first_signal_at', 'desc')
          .limit(10)
          .select('id', 'category', 'first_signal_at', 'outcome')
      : [],
  ]);
  const [falseAlarms, messages, centre] = await Promise.all([
    siteId ? siteFalseAlarms(db, siteId) : null,
    db('keyholder_messages').where({ event_id: eventId }).orderBy('queued_at'),
    site?.monitoring_centre_id
      ? db('organisations').where({ id: site.monitoring_centre_id }).first('callout_wait_minutes')
      : undefined,
  ]);
  const iso = (value: unknown) => (value instanceof Date ? value.toISOString() : null);
  const seconds = (from: unknown, to: unknown) =>
    from instanceof Date && to instanceof Date
      ? Math.round((to.getTime() - from.getTime()) / 1000)
      : null;
  const police = policeEligibility(
    {
      category: row.category as string,
      confirmed: row.confirmed as boolean,
      status: row.status as string,
    },
    site ? { police_urn: site.police_urn, urn_status: site.urn_status } : null,
  );
  return {
    event: toEvent(row),
    callOut: {
      status: row.callout_status as string,
      waitMinutes: Number(centre?.callout_wait_minutes ?? 5),
      attending: (row.attending_keyholder as string | null) ?? null,
      messages: messages.map((message: Record<string, unknown>) => ({
        id: message.id as string,
        position: message.call_order as number,
        name: message.keyholder_name as string,
        phone: message.phone as string,
        status: message.status as string,
        reply: (message.reply as string | null) ?? null,
        queuedAt: iso(message.queued_at)!,
        sentAt: iso(message.sent_at),
        deliveredAt: iso(message.delivered_at),
        repliedAt: iso(message.replied_at),
      })),
    },
    police: {
      ...police,
      urn: site?.police_urn ?? null,
      requestedAt: iso(row.police_requested_at),
      incidentReference: (row.police_incident_reference as string | null) ?? null,
    },
    handling: {
      secondsToTake: seconds(row.first_signal_at, row.taken_at),
      secondsToClose: seconds(row.first_signal_at, row.closed_at),
    },
    falseAlarms,
    site: site
      ? {
          name: site.name,
          reference: site.reference,
          address: [site.address_line1, site.address_line2, site.town, site.postcode].filter(
            Boolean,
          ),
          hazards: site.hazards ?? '',
          accessNotes: site.access_notes ?? '',
          policeUrn: site.police_urn,
          urnStatus: site.urn_status,
          confirmationWindowMinutes: site.confirmation_window_minutes,
        }
      : null,
    callPlan: keyholders.map((keyholder: Record<string, unknown>) => ({
      position: keyholder.call_order as number,
      name: keyholder.name as string,
      phone: keyholder.phone as string,
      minutesToAttend: keyholder.minutes_to_attend as number,
    })),
    recentEvents: recent.map((event: Record<string, unknown>) => ({
      id: event.id as string,
      category: event.category as string,
      at: (event.first_signal_at as Date).toISOString(),
      outcome: (event.outcome as string | null) ?? null,
    })),
    timeline: timeline.map((entry: Record<string, unknown>) => ({
      at: (entry.at as Date).toISOString(),
      kind: entry.kind as string,
      text: entry.text as string,
      actor: (entry.actor as string | null) ?? null,
    })),
  };
}

/** Taking an event locks it to one operator, so two never call the same keyholders. */
export async function takeEvent(
  db: Knex,
  centreIds: string[],
  eventId: string,
  user: { id: string; displayName: string },
  actor: Actor,
) {
  await findEvent(db, centreIds, eventId);
  await db.transaction(async (trx) => {
    const event = await trx('alarm_events as e')
      .leftJoin('users as u', 'u.id', 'e.taken_by')
      .where('e.id', eventId)
      .forUpdate('e')
      .first('e.status', 'e.taken_by', 'u.display_name as taken_by_name');
    if (event.status === 'closed') throw new ConflictError('This event is closed already.');
    if (event.status === 'taken' && event.taken_by !== user.id)
      throw new ConflictError(`${event.taken_by_name ?? 'Another operator'} has taken this event.`);
    if (event.status === 'taken') return;
    await trx('alarm_events')
      .where({ id: eventId })
      .update({ status: 'taken', taken_by: user.id, taken_at: trx.fn.now() });
    await trx('event_timeline').insert({
      event_id: eventId,
      kind: 'taken',
      text: `Taken by ${user.displayName}.`,
      actor_user_id: user.id,
    });
    await notifyChange(trx, { eventId });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'alarm_event.taken',
      entityType: 'alarm_event',
      entityId: eventId,
      summary: `Alarm event taken by ${user.displayName}`,
    });
  });
}

export async function closeEvent(
  db: Knex,
  centreIds: string[],
  eventId: string,
  input: { outcome: Outcome; note: string },
  user: { id: string; displayName: string },
  actor: Actor,
) {
  await findEvent(db, centreIds, eventId);
  await db.transaction(async (trx) => {
    const event = await trx('alarm_events').where({ id: eventId }).forUpdate().first();
    if (event.status === 'closed') throw new ConflictError('This event is closed already.');
    if (event.taken_by !== user.id)
      throw new ConflictError('Take the event before closing it, so the record shows who did.');
    await trx('alarm_events')
      .where({ id: eventId })
      .update({ status: 'closed', closed_at: trx.fn.now(), outcome: input.outcome });
    await trx('event_timeline').insert({
      event_id: eventId,
      kind: 'closed',
      text: `Closed: ${OUTCOME_LABELS[input.outcome]}.${input.note ? ` ${input.note}` : ''}`,
      actor_user_id: user.id,
    });
    await notifyChange(trx, { eventId });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'alarm_event.closed',
      entityType: 'alarm_event',
      entityId: eventId,
      summary: `Alarm event closed: ${OUTCOME_LABELS[input.outcome]}`,
    });
  });
}

/** How quickly events are taken and closed: medians and the 90th centile, in seconds. */
export async function handlingFigures(db: Knex, centreIds: string[]) {
  const period = async (hours: number) => {
    const row = await db('alarm_events as e')
      .join('sites as s', 's.id', 'e.site_id')
      .whereIn('s.monitoring_centre_id', centreIds)
      .where('e.first_signal_at', '>', db.raw('now() - make_interval(hours => ?)', [hours]))
      .first(
        db.raw('count(*)::int as events'),
        db.raw("count(*) filter (where e.status = 'closed')::int as closed"),
        db.raw(
          'percentile_cont(0.5) within group (order by extract(epoch from e.taken_at - e.first_signal_at)) as median_take',
        ),
        db.raw(
          'percentile_cont(0.9) within group (order by extract(epoch from e.taken_at - e.first_signal_at)) as p90_take',
        ),
        db.raw(
          'percentile_cont(0.5) within group (order by extract(epoch from e.closed_at - e.first_signal_at)) as median_close',
        ),
      );
    const rounded = (value: unknown) => (value === null ? null : Math.round(Number(value)));
    return {
      events: Number(row.events),
      closed: Number(row.closed),
      medianSecondsToTake: rounded(row.median_take),
      p90SecondsToTake: rounded(row.p90_take),
      medianSecondsToClose: rounded(row.median_close),
    };
  };
  const [last24Hours, last7Days] = await Promise.all([period(24), period(24 * 7)]);
  return { last24Hours, last7Days };
}
