import type { Knex } from 'knex';
import { OUTCOME_LABELS, type Outcome } from '../server/monitoring/schema';
import { simulatedFrame } from '../server/monitoring/simulator';
import { DEMO_ACCOUNTS, DEMO_MONITORING_CENTRE } from './data/demo-scenario';

/**
 * A little history for the demo's monitored sites, once (only while no signal exists): the
 * Marsh residence's sets, unsets and periodic tests over the last fortnight, and a false alarm
 * handled in the summer; and the site whose police response is on a warning, with the two
 * false alarms that put it there (NPCC policy). Times are relative to the day of seeding.
 */
export async function seed(knex: Knex): Promise<void> {
  if (await knex('signals').first('id')) return;
  const centre = await knex('organisations').where(DEMO_MONITORING_CENTRE).first('id');
  if (!centre) return;
  const sites = await knex('sites')
    .where({ monitoring_centre_id: centre.id })
    .orderBy('reference')
    .select('id', 'reference', 'monitoring_account', 'urn_status');
  const marsh = sites.find((site) => site.monitoring_account === '1000');
  const warned = sites.find((site) => site.urn_status === 'warning');
  if (!marsh) return;
  const operatorEmail = DEMO_ACCOUNTS.find((account) => account.role === 'operator')!.email;
  const operator = await knex('users').where({ email: operatorEmail }).first('id', 'display_name');

  const now = Date.now();
  const hoursAgo = (hours: number) => new Date(now - hours * 3_600_000);
  let sequence = 100;

  async function signal(
    site: { id: string; monitoring_account: string },
    at: Date,
    code: string,
    zone: number,
    qualifier: 'new' | 'restore',
    eventId: string | null = null,
  ) {
    const raw = simulatedFrame(
      {
        format: 'adm-cid',
        account: site.monitoring_account,
        code,
        zone,
        partition: 1,
        qualifier,
        sequence: sequence++,
        receiver: '1',
        linePrefix: '1',
      },
      at,
    );
    const category =
      code === '602'
        ? 'test'
        : code === '401'
          ? 'open_close'
          : code === '130'
            ? 'burglary'
            : 'other';
    await knex('signals').insert({
      received_at: at,
      transport: 'dc09_tcp',
      protocol: 'ADM-CID',
      account: site.monitoring_account,
      sequence: String(sequence - 1).padStart(4, '0'),
      receiver: '1',
      line_prefix: '1',
      data: raw.slice(raw.indexOf('[') + 1, raw.indexOf(']')),
      panel_time: at,
      raw: raw.trim(),
      site_id: site.id,
      event_code: code,
      category,
      qualifier,
      zone_or_user: zone,
      partition: 1,
      event_id: eventId,
    });
  }

  /** A burglary that turned out false, handled start to finish by the demo operator. */
  async function falseAlarm(
    site: { id: string; monitoring_account: string },
    at: Date,
    zone: number,
    outcome: Outcome,
    note: string,
  ) {
    const minutes = (n: number) => new Date(at.getTime() + n * 60_000);
    const keyholder = await knex('keyholders')
      .where({ site_id: site.id, call_order: 1 })
      .first('id', 'name', 'phone', 'minutes_to_attend');
    const [event] = await knex('alarm_events')
      .insert({
        site_id: site.id,
        account: site.monitoring_account,
        category: 'burglary',
        priority: 3,
        status: 'closed',
        zones: [zone],
        first_signal_at: at,
        last_signal_at: minutes(4),
        restored_at: minutes(4),
        taken_by: operator?.id ?? null,
        taken_at: minutes(1),
        closed_at: minutes(38),
        outcome,
        callout_status: 'accepted',
        attending_keyholder: keyholder.name,
      })
      .returning<{ id: string }[]>('id');
    const eventId = event!.id;
    await signal(site, at, '130', zone, 'new', eventId);
    await signal(site, minutes(4), '130', zone, 'restore', eventId);
    await knex('keyholder_messages').insert({
      event_id: eventId,
      keyholder_id: keyholder.id,
      call_order: 1,
      keyholder_name: keyholder.name,
      phone: keyholder.phone,
      body: 'Demo history: alert text.',
      reference: `DEMO${String(sequence).slice(-2)}`,
      status: 'delivered',
      attempts: 1,
      queued_at: minutes(2),
      sent_at: minutes(2),
      delivered_at: minutes(2),
      reply: 'attending',
      replied_at: minutes(5),
    });
    const by = operator?.display_name ?? 'the operator';
    const steps: [number, string, string][] = [
      [0, 'received', `Intruder alarm on zone ${zone}, account ${site.monitoring_account}.`],
      [1, 'taken', `Taken by ${by}.`],
      [2, 'message', `Text to ${keyholder.name} (1st in the call plan) queued.`],
      [2, 'message', `Text to ${keyholder.name} delivered.`],
      [4, 'restored', `Restored on zone ${zone}.`],
      [
        5,
        'reply',
        `${keyholder.name} replied 1: attending (about ${keyholder.minutes_to_attend} minutes away).`,
      ],
      [38, 'closed', `Closed: ${OUTCOME_LABELS[outcome]}. ${note}`],
    ];
    await knex('event_timeline').insert(
      steps.map(([offset, kind, text]) => ({
        event_id: eventId,
        at: minutes(offset),
        kind,
        text,
        actor_user_id: ['taken', 'closed'].includes(kind) ? (operator?.id ?? null) : null,
      })),
    );
  }

  // Fourteen days of the household's routine: set at 08:10, unset at 17:40, a daily test.
  for (let day = 14; day >= 1; day -= 1) {
    await signal(marsh, hoursAgo(day * 24 + 2), '602', 0, 'new');
    await signal(marsh, hoursAgo(day * 24 - 8), '401', 1, 'restore');
    await signal(marsh, hoursAgo(day * 24 - 17), '401', 2, 'new');
  }
  await falseAlarm(
    marsh,
    hoursAgo(24 * 120),
    4,
    'false_alarm_user',
    'Helen Marsh set the system with the landing window open.',
  );
  if (warned) {
    await falseAlarm(
      warned,
      hoursAgo(24 * 200),
      3,
      'false_alarm_environment',
      'Balloons left in the hall moved in the heating.',
    );
    await falseAlarm(
      warned,
      hoursAgo(24 * 45),
      5,
      'false_alarm_equipment',
      'Detector replaced on the next service visit.',
    );
  }
}
