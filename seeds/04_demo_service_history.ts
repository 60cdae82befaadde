import type { Knex } from 'knex';
import { addCalendarMonths } from '../server/calc/service-plan';
import { DEMO_ACCOUNTS, DEMO_INSTALLER } from './data/demo-scenario';

const ukToday = () => new Intl.DateTimeFormat('en-CA', { timeZone: 'Europe/London' }).format();

/**
 * Two past preventive visits, once (only while no visit exists), dated from the day of seeding
 * so the demo shows both reminders on first start: the Marsh residence (monitored, two visits
 * a year) is due in ten days, so Helen Marsh is e-mailed; S-0008's last visit was fourteen
 * months ago, overdue under either plan, so the office is e-mailed.
 */
export async function seed(knex: Knex): Promise<void> {
  if (await knex('service_visits').first('id')) return;
  const installer = await knex('organisations').where(DEMO_INSTALLER).first('id');
  if (!installer) return;
  const engineerEmail = DEMO_ACCOUNTS.find((account) => account.role === 'engineer')!.email;
  const engineer = await knex('users').where({ email: engineerEmail }).first('id');
  const sites = await knex('sites')
    .where({ installer_id: installer.id })
    .whereIn('reference', ['S-0001', 'S-0008'])
    .select('id', 'reference', 'monitoring_centre_id');
  const today = ukToday();
  const daysFrom = (isoDate: string, days: number) =>
    new Date(Date.parse(`${isoDate}T12:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
  for (const site of sites) {
    const doneOn =
      site.reference === 'S-0001'
        ? daysFrom(addCalendarMonths(today, -6), 10)
        : addCalendarMonths(today, -14);
    await knex('service_visits').insert({
      site_id: site.id,
      kind: 'preventive',
      status: 'done',
      due_date: doneOn,
      completed_at: `${doneOn}T10:30:00Z`,
      engineer_id: engineer?.id ?? null,
      plan_visits_per_year: site.monitoring_centre_id ? 2 : 1,
      checklist: JSON.stringify({
        outcome: { words: 'All checks passed.', passed: true, findings: [] },
      }),
    });
  }
}
