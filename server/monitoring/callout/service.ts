import type { Knex } from 'knex';
import { recordAuditEntry, type AuditEntryInput } from '../../audit/repository';
import { policeEligibility } from '../../calc/police-response';
import { ConflictError } from '../../http/errors';
import { notifyChange } from '../live';
import {
  composeAlertText,
  newMessageReference,
  type AlertCategory,
  type KeyholderReply,
} from './compose';

type Actor = Pick<AuditEntryInput, 'actorUserId' | 'actorLabel' | 'ip' | 'requestId'>;
type Operator = { id: string; displayName: string };

interface KeyholderRow {
  id: string;
  call_order: number;
  name: string;
  phone: string;
  minutes_to_attend: number;
  unavailable: { from: string; to: string; note: string }[];
}

interface EventRow {
  id: string;
  site_id: string | null;
  category: AlertCategory;
  confirmed: boolean;
  status: 'open' | 'taken' | 'closed';
  taken_by: string | null;
  callout_status: 'not_started' | 'calling' | 'accepted' | 'exhausted';
  first_signal_at: Date;
}

const ordinal = (n: number) =>
  `${n}${n % 10 === 1 && n % 100 !== 11 ? 'st' : n % 10 === 2 && n % 100 !== 12 ? 'nd' : n % 10 === 3 && n % 100 !== 13 ? 'rd' : 'th'}`;

async function addToTimeline(
  trx: Knex,
  eventId: string,
  kind: string,
  text: string,
  actorUserId: string | null = null,
) {
  await trx('event_timeline').insert({
    event_id: eventId,
    kind,
    text,
    actor_user_id: actorUserId,
  });
}

/** A keyholder who has said they are away today is passed over, with the reason on record. */
function awayNote(keyholder: KeyholderRow, today: string): string | null {
  const away = keyholder.unavailable.find((range) => range.from <= today && today <= range.to);
  return away ? away.note || 'marked unavailable' : null;
}

const londonDate = new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London' });

/**
 * Queues a text to the next keyholder after `afterPosition` who is not away, inside the caller's
 * transaction (the outbox: the message exists if and only if the decision to send it does).
 * Returns false when the call plan is used up.
 */
async function queueNextKeyholder(trx: Knex, event: EventRow, afterPosition: number) {
  if (!event.site_id) return false;
  const keyholders: KeyholderRow[] = await trx('keyholders')
    .where({ site_id: event.site_id })
    .where('call_order', '>', afterPosition)
    .orderBy('call_order')
    .select('id', 'call_order', 'name', 'phone', 'minutes_to_attend', 'unavailable');
  const today = londonDate.format(new Date());
  for (const keyholder of keyholders) {
    const away = awayNote(keyholder, today);
    if (away) {
      await addToTimeline(
        trx,
        event.id,
        'callout',
        `Passed over ${keyholder.name} (${ordinal(keyholder.call_order)} in the call plan): ${away}.`,
      );
      continue;
    }
    const site = await trx('sites as s')
      .join('organisations as c', 'c.id', 's.monitoring_centre_id')
      .where('s.id', event.site_id)
      .first('s.name', 's.town', 'c.name as centre_name');
    const reference = newMessageReference();
    await trx('keyholder_messages').insert({
      event_id: event.id,
      keyholder_id: keyholder.id,
      call_order: keyholder.call_order,
      keyholder_name: keyholder.name,
      phone: keyholder.phone,
      reference,
      body: composeAlertText({
        centreName: site.centre_name,
        category: event.category,
        confirmed: event.confirmed,
        siteName: site.name,
        town: site.town,
        raisedAt: event.first_signal_at,
        reference,
      }),
    });
    await addToTimeline(
      trx,
      event.id,
      'message',
      `Text to ${keyholder.name} (${ordinal(keyholder.call_order)} in the call plan) queued.`,
    );
    return true;
  }
  return false;
}

/**
 * FOR NO KEY UPDATE, not FOR UPDATE: timeline and message rows that point at the event take a
 * key-share lock on it as they are inserted, and a full update lock would make a delivery
 * callback (message row, then event) and a reply (event, then message row) deadlock.
 */
async function lockEvent(trx: Knex, eventId: string): Promise<EventRow> {
  return trx('alarm_events')
    .where({ id: eventId })
    .forNoKeyUpdate()
    .first(
      'id',
      'site_id',
      'category',
      'confirmed',
      'status',
      'taken_by',
      'callout_status',
      'first_signal_at',
    );
}

async function exhausted(trx: Knex, eventId: string) {
  await trx('alarm_events').where({ id: eventId }).update({ callout_status: 'exhausted' });
  await addToTimeline(
    trx,
    eventId,
    'callout',
    'No keyholder has accepted and the call plan is used up: phone the keyholders.',
  );
}

/** The operator starts messaging the site's keyholders in call order. */
export async function startCallOut(
  db: Knex,
  eventId: string,
  user: Operator,
  actor: Actor,
): Promise<void> {
  await db.transaction(async (trx) => {
    const event = await lockEvent(trx, eventId);
    if (event.status === 'closed') throw new ConflictError('This event is closed already.');
    if (event.taken_by !== user.id)
      throw new ConflictError('Take the event before messaging keyholders.');
    if (event.callout_status === 'calling' || event.callout_status === 'accepted')
      throw new ConflictError('Keyholders are being messaged already.');
    if (!event.site_id)
      throw new ConflictError('No site has this account, so there is no call plan to use.');
    const wait = await waitMinutesFor(trx, event.site_id);
    await addToTimeline(
      trx,
      eventId,
      'callout',
      `${user.displayName} started messaging keyholders in call order, ${wait} minutes for each to accept.`,
      user.id,
    );
    if (!(await queueNextKeyholder(trx, event, 0))) {
      throw new ConflictError('This site has no keyholder who can be messaged today.');
    }
    await trx('alarm_events').where({ id: eventId }).update({ callout_status: 'calling' });
    await notifyChange(trx, { eventId });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'alarm_event.callout_started',
      entityType: 'alarm_event',
      entityId: eventId,
      summary: 'Keyholder call-out started',
    });
  });
}

/**
 * For centres that message keyholders without waiting for an operator: called by the receiver
 * inside the transaction that opens a burglary or fire event.
 */
export async function startAutomaticCallOut(trx: Knex, eventId: string): Promise<void> {
  const event = await lockEvent(trx, eventId);
  if (!event.site_id || !['burglary', 'fire'].includes(event.category)) return;
  const centre = await trx('sites as s')
    .join('organisations as c', 'c.id', 's.monitoring_centre_id')
    .where('s.id', event.site_id)
    .first('c.callout_automatic', 'c.callout_wait_minutes');
  if (!centre?.callout_automatic) return;
  await addToTimeline(
    trx,
    eventId,
    'callout',
    `Messaging keyholders automatically, ${centre.callout_wait_minutes} minutes for each to accept.`,
  );
  if (await queueNextKeyholder(trx, event, 0)) {
    await trx('alarm_events').where({ id: eventId }).update({ callout_status: 'calling' });
  } else {
    await addToTimeline(trx, eventId, 'callout', 'This site has no keyholder to message today.');
  }
}

export async function waitMinutesFor(db: Knex, siteId: string): Promise<number> {
  const row = await db('sites as s')
    .join('organisations as c', 'c.id', 's.monitoring_centre_id')
    .where('s.id', siteId)
    .first('c.callout_wait_minutes');
  return Number(row?.callout_wait_minutes ?? 5);
}

/**
 * The durable escalation job lands here when a keyholder's wait is over. It moves on only when
 * that message is still the newest for the event and nobody has accepted, so a job that runs
 * late, twice, or after a reply does nothing.
 */
export async function escalateIfUnanswered(db: Knex, messageId: string): Promise<boolean> {
  return db.transaction(async (trx) => {
    const message = await trx('keyholder_messages').where({ id: messageId }).first();
    if (!message) return false;
    const event = await lockEvent(trx, message.event_id);
    if (event.status === 'closed' || event.callout_status !== 'calling') return false;
    if (message.reply === 'attending') return false;
    const later = await trx('keyholder_messages')
      .where({ event_id: event.id })
      .where('call_order', '>', message.call_order)
      .first('id');
    if (later) return false;
    const wait = event.site_id ? await waitMinutesFor(trx, event.site_id) : 5;
    if (message.reply !== 'cannot_attend') {
      await addToTimeline(
        trx,
        event.id,
        'callout',
        `No acceptance from ${message.keyholder_name} within ${wait} minutes.`,
      );
    }
    if (!(await queueNextKeyholder(trx, event, message.call_order))) await exhausted(trx, event.id);
    await notifyChange(trx, { eventId: event.id });
    return true;
  });
}

export interface ReplyOutcome {
  eventId: string;
  messageId: string;
  /** True when the call plan should move on now rather than after the wait. */
  moveOn: boolean;
}

/**
 * A keyholder's answer, by text or in the app. "Attending" ends the call-out; "can't attend"
 * moves straight to the next keyholder if this was the newest message.
 */
export async function recordKeyholderReply(
  trx: Knex,
  messageId: string,
  reply: KeyholderReply,
  via: 'text' | 'app',
): Promise<ReplyOutcome> {
  // The message row first, then the event: the same order as the delivery callbacks take.
  const message = await trx('keyholder_messages').where({ id: messageId }).forUpdate().first();
  const event = await lockEvent(trx, message.event_id);
  await trx('keyholder_messages')
    .where({ id: messageId })
    .update({ reply, replied_at: trx.fn.now() });
  const keyholder = message.keyholder_id
    ? await trx('keyholders').where({ id: message.keyholder_id }).first('minutes_to_attend')
    : undefined;
  const how =
    via === 'text' ? `replied ${reply === 'attending' ? '1' : '2'}` : 'answered in the app';
  let moveOn = false;
  if (reply === 'attending') {
    const eta = keyholder ? ` (about ${keyholder.minutes_to_attend} minutes away)` : '';
    await addToTimeline(
      trx,
      event.id,
      'reply',
      `${message.keyholder_name} ${how}: attending${eta}.`,
    );
    if (event.status !== 'closed' && event.callout_status !== 'accepted') {
      await trx('alarm_events')
        .where({ id: event.id })
        .update({ callout_status: 'accepted', attending_keyholder: message.keyholder_name });
    }
  } else {
    await addToTimeline(trx, event.id, 'reply', `${message.keyholder_name} ${how}: cannot attend.`);
    const later = await trx('keyholder_messages')
      .where({ event_id: event.id })
      .where('call_order', '>', message.call_order)
      .first('id');
    if (event.status !== 'closed' && event.callout_status === 'calling' && !later) {
      if (!(await queueNextKeyholder(trx, event, message.call_order)))
        await exhausted(trx, event.id);
      moveOn = true;
    }
  }
  await notifyChange(trx, { eventId: event.id });
  return { eventId: event.id, messageId, moveOn };
}

/** The message a text from this number answers: the newest alert sent to it in the last day. */
export async function messageAnsweredBy(db: Knex, phone: string) {
  return db('keyholder_messages')
    .where({ phone })
    .whereIn('status', ['sending', 'sent', 'delivered'])
    .where('queued_at', '>', db.raw("now() - interval '1 day'"))
    .orderBy('queued_at', 'desc')
    .first('id', 'event_id', 'keyholder_name');
}

export const CALL_RESULTS = [
  'attending',
  'cannot_attend',
  'no_answer',
  'left_message',
  'other',
] as const;
export type CallResult = (typeof CALL_RESULTS)[number];
const CALL_RESULT_WORDS: Record<CallResult, string> = {
  attending: 'attending',
  cannot_attend: 'cannot attend',
  no_answer: 'no answer',
  left_message: 'left a message',
  other: 'see note',
};

/** A phone call the operator made, kept on the timeline. */
export async function recordCall(
  db: Knex,
  eventId: string,
  input: { position: number | null; who: string; result: CallResult; note: string },
  user: Operator,
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const event = await lockEvent(trx, eventId);
    if (event.status === 'closed') throw new ConflictError('This event is closed already.');
    if (event.taken_by !== user.id)
      throw new ConflictError('Take the event before recording calls.');
    let who = input.who;
    if (input.position !== null) {
      const keyholder = event.site_id
        ? await trx('keyholders')
            .where({ site_id: event.site_id, call_order: input.position })
            .first('name')
        : undefined;
      if (!keyholder)
        throw new ConflictError(`Nobody is number ${input.position} in this site's call plan.`);
      who = keyholder.name;
    }
    await addToTimeline(
      trx,
      eventId,
      'call',
      `Called ${who}: ${CALL_RESULT_WORDS[input.result]}.${input.note ? ` ${input.note}` : ''}`,
      user.id,
    );
    if (input.result === 'attending' && event.callout_status !== 'accepted') {
      await trx('alarm_events')
        .where({ id: eventId })
        .update({ callout_status: 'accepted', attending_keyholder: who });
    }
    await notifyChange(trx, { eventId });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'alarm_event.call_recorded',
      entityType: 'alarm_event',
      entityId: eventId,
      summary: `Call to ${who} recorded: ${CALL_RESULT_WORDS[input.result]}`,
    });
  });
}

export async function requestPolice(
  db: Knex,
  eventId: string,
  input: { incidentReference: string; note: string },
  user: Operator,
  actor: Actor,
) {
  await db.transaction(async (trx) => {
    const event = await lockEvent(trx, eventId);
    if (event.status === 'closed') throw new ConflictError('This event is closed already.');
    if (event.taken_by !== user.id)
      throw new ConflictError('Take the event before requesting police.');
    const site = event.site_id
      ? await trx('sites').where({ id: event.site_id }).first('police_urn', 'urn_status')
      : null;
    const { eligible, reason } = policeEligibility(event, site ?? null);
    if (!eligible) throw new ConflictError(reason);
    const already = await trx('alarm_events').where({ id: eventId }).first('police_requested_at');
    if (already.police_requested_at) throw new ConflictError('Police were requested already.');
    await trx('alarm_events').where({ id: eventId }).update({
      police_requested_at: trx.fn.now(),
      police_incident_reference: input.incidentReference,
    });
    await addToTimeline(
      trx,
      eventId,
      'police',
      `Police requested quoting URN ${site!.police_urn}; incident reference ${input.incidentReference}.${input.note ? ` ${input.note}` : ''}`,
      user.id,
    );
    await notifyChange(trx, { eventId });
    await recordAuditEntry(trx, {
      ...actor,
      action: 'alarm_event.police_requested',
      entityType: 'alarm_event',
      entityId: eventId,
      summary: `Police requested, incident ${input.incidentReference}`,
    });
  });
}
