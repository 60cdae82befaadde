import type { Knex } from 'knex';
import type { Logger } from 'pino';
import { daysBetween, SERVICE_PLAN_RULE, SERVICE_PLAN_SOURCE } from '../calc/service-plan';
import type { Mailer } from '../mail/mailer';
import { planFacts } from '../service/repository';
import { planOf } from '../service/service';
import type { SmsSender } from '../sms/sender';

/** How far ahead a homeowner hears that a visit is due (common practice, no source). */
export const DUE_SOON_DAYS = 14;

export interface ReminderDeps {
  db: Knex;
  mailer: Mailer;
  /** Texts go only where the homeowner has given a mobile number. */
  sms?: SmsSender;
  logger: Logger;
}

type Kind = 'visit_due_soon' | 'visit_overdue';

const longDate = new Intl.DateTimeFormat('en-GB', {
  day: 'numeric',
  month: 'long',
  year: 'numeric',
  timeZone: 'UTC',
});
const dayOf = (isoDate: string) => longDate.format(new Date(`${isoDate}T00:00:00Z`));

/**
 * Sends each reminder once. The row is written first, under a unique key (site, kind, due date,
 * channel, recipient): a second sweep, a sweep in another process or a restart finds it and
 * sends nothing. A crash between writing and sending loses that one reminder rather than
 * sending it twice; it stays "sending" for the office to see.
 */
async function once(
  deps: ReminderDeps,
  key: { siteId: string; kind: Kind; dueDate: string; channel: 'email' | 'sms'; recipient: string },
  send: () => Promise<void>,
): Promise<'sent' | 'failed' | 'already'> {
  const [claimed] = await deps
    .db('service_reminders')
    .insert({
      site_id: key.siteId,
      kind: key.kind,
      due_date: key.dueDate,
      channel: key.channel,
      recipient: key.recipient,
    })
    .onConflict(['site_id', 'kind', 'due_date', 'channel', 'recipient'])
    .ignore()
    .returning<{ id: string }[]>('id');
  if (!claimed) return 'already';
  try {
    await send();
    await deps
      .db('service_reminders')
      .where({ id: claimed.id })
      .update({ status: 'sent', sent_at: deps.db.fn.now() });
    return 'sent';
  } catch (error) {
    deps.logger.warn({ err: error, reminder: key }, 'service reminder not sent');
    await deps
      .db('service_reminders')
      .where({ id: claimed.id })
      .update({ status: 'failed', error: (error as Error).message });
    return 'failed';
  }
}

/**
 * One pass over every installer's sites on the UK day `today`: homeowners hear a visit is due
 * within DUE_SOON_DAYS (e-mail, and a text where they gave a mobile); the installer's office
 * hears when a site's visit is overdue.
 */
export async function sendServiceReminders(deps: ReminderDeps, today: string) {
  const { db } = deps;
  const tally = { sent: 0, failed: 0, already: 0 };
  const installerIds: string[] = await db('organisations').where({ kind: 'installer' }).pluck('id');
  if (installerIds.length === 0) return tally;
  const rows = await db.transaction(async (trx) => {
    // See overdueSites: the whole-company plan query is cheaper without JIT compilation.
    await trx.raw('set local jit = off');
    return planFacts(trx, { installerIds });
  });

  // Who hears about which site, read once for the pass rather than once per site.
  const [installers, officeStaff, homeownerRows] = await Promise.all([
    db('sites as s')
      .join('organisations as i', 'i.id', 's.installer_id')
      .whereIn('s.installer_id', installerIds)
      .select('s.id as site_id', 's.installer_id', 'i.name as installer_name'),
    db('memberships as m')
      .join('users as u', 'u.id', 'm.user_id')
      .whereIn('m.organisation_id', installerIds)
      .where('m.role', 'office')
      .select('m.organisation_id', 'u.email', 'u.display_name'),
    db('site_homeowners as h')
      .join('users as u', 'u.id', 'h.user_id')
      .select('h.site_id', 'u.email', 'u.display_name', 'u.phone'),
  ]);
  const siteInstaller = new Map(installers.map((site) => [site.site_id as string, site]));
  const groupBy = <T extends Record<string, unknown>>(items: T[], key: string) => {
    const groups = new Map<string, T[]>();
    for (const item of items)
      groups.set(item[key] as string, [...(groups.get(item[key] as string) ?? []), item]);
    return groups;
  };
  const officeOf = groupBy(officeStaff, 'organisation_id');
  const homeownersOf = groupBy(homeownerRows, 'site_id');

  for (const row of rows) {
    const plan = planOf(row, today);
    if (!plan.nextDueOn) continue;
    const daysToGo = daysBetween(today, plan.nextDueOn);
    const site = siteInstaller.get(row.site_id)!;
    const count = (outcome: 'sent' | 'failed' | 'already') => (tally[outcome] += 1);

    if (plan.overdue) {
      for (const person of officeOf.get(site.installer_id) ?? []) {
        count(
          await once(
            deps,
            {
              siteId: row.site_id,
              kind: 'visit_overdue',
              dueDate: plan.nextDueOn,
              channel: 'email',
              recipient: person.email,
            },
            () =>
              deps.mailer.send({
                to: person.email,
                subject: `Service visit overdue: ${row.name} (${row.reference})`,
                text: [
                  `Hello ${person.display_name},`,
                  '',
                  `The preventive visit at ${row.name}, ${row.town} (${row.reference}) was due on ${dayOf(plan.nextDueOn!)}: ${plan.daysOverdue} day${plan.daysOverdue === 1 ? '' : 's'} ago.`,
                  plan.bookedVisit
                    ? `A visit is booked for ${dayOf(plan.bookedVisit.dueDate)}.`
                    : 'No visit is booked yet: book one from the service schedule.',
                  '',
                  `Plan: ${SERVICE_PLAN_RULE} (${SERVICE_PLAN_SOURCE}).`,
                  '',
                  'Wardbook',
                ].join('\n'),
              }),
          ),
        );
      }
      continue;
    }

    if (daysToGo < 0 || daysToGo > DUE_SOON_DAYS) continue;
    const booked = plan.bookedVisit
      ? `It is booked for ${dayOf(plan.bookedVisit.dueDate)}.`
      : `${site.installer_name} will be in touch to book it.`;
    for (const person of homeownersOf.get(row.site_id) ?? []) {
      const key = { siteId: row.site_id, kind: 'visit_due_soon' as const, dueDate: plan.nextDueOn };
      count(
        await once(deps, { ...key, channel: 'email', recipient: person.email }, () =>
          deps.mailer.send({
            to: person.email,
            subject: `Your alarm is due its service visit on ${dayOf(plan.nextDueOn!)}`,
            text: [
              `Hello ${person.display_name},`,
              '',
              `The alarm at ${row.name} is due its preventive service visit on ${dayOf(plan.nextDueOn!)}. ${booked}`,
              '',
              'Regular visits keep the system working and false alarms down; insurers and police response may depend on them.',
              '',
              `${site.installer_name}, through Wardbook`,
            ].join('\n'),
          }),
        ),
      );
      if (person.phone && deps.sms) {
        const sms = deps.sms;
        const phone = person.phone;
        count(
          await once(deps, { ...key, channel: 'sms', recipient: phone }, async () => {
            // No address and no codes in a text, as with alarm texts.
            await sms.send({
              to: phone,
              body: `${site.installer_name}: the alarm at ${row.name} is due its service visit on ${dayOf(plan.nextDueOn!)}. ${booked}`,
            });
          }),
        );
      }
    }
  }
  return tally;
}
