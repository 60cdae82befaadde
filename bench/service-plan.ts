import { servicePlan } from '../server/calc/service-plan';
import { createDb } from '../server/db/knex';
import { overdueSites, schedule, servicePlanForSite, ukDateOf } from '../server/service/service';
import { benchDatabase, timed } from './lib/database';
import { median } from './lib/load';
import { seedBenchData } from './records';

/**
 * Issue 7's benchmark, at product.md's scale for one company (5,000 sites, 80,000 zones):
 * service plans worked out per second (pure), the overdue list over every site, one site's
 * plan, and a four-week schedule. Prints figures; never passes or fails on them.
 *
 *   npx tsx bench/service-plan.ts
 *
 * Runs on a throwaway database of its own, on the PostgreSQL the tests use; the tests' helper
 * starts (or reuses) the server and stops it only if nothing else still needs it.
 */
const RUNS = Number(process.env.BENCH_RUNS ?? 5);

function plansPerSecond(): number {
  const facts = Array.from({ length: 1000 }, (_, index) => ({
    signalling: {
      monitoringCentreLinked: index % 2 === 0,
      signallingPaths: [{ toMonitoringCentre: index % 3 === 0 }],
    },
    inService: { on: `2025-${String(1 + (index % 12)).padStart(2, '0')}-28`, visitsPerYear: 2 },
    lastPreventiveVisit:
      index % 5 === 0
        ? null
        : { on: `2026-${String(1 + (index % 12)).padStart(2, '0')}-28`, visitsPerYear: 1 },
    today: '2027-01-15',
  }));
  let count = 0;
  const started = performance.now();
  while (performance.now() - started < 1000) {
    for (const item of facts) servicePlan(item);
    count += facts.length;
  }
  return count / ((performance.now() - started) / 1000);
}

// The demo seed is not wanted here: the bench company is the only one.
const { database: connection, finish } = await benchDatabase('service');
try {
  const rates = [plansPerSecond(), plansPerSecond(), plansPerSecond()];
  console.log(`Service plans (pure calculation): ${median(rates).toFixed(0)} per second`);

  const seeded = await seedBenchData(connection);
  const db = createDb(connection, 4);
  try {
    const installerId = (await db('sites').where({ id: seeded.siteId }).first('installer_id'))
      .installer_id as string;
    // Monitored sites signal over one path; every zone was walk-tested at commissioning; four
    // sites in five have had a preventive visit at some point in the last two years; two in
    // five have the next one booked within the next eight weeks.
    await db.raw(
      `insert into signalling_paths (system_id, position, bearer, to_monitoring_centre)
       select y.id, 1, 'ip', true from systems y join sites s on s.id = y.site_id
        where s.monitoring_centre_id is not null`,
    );
    await db.raw(
      `insert into walk_tests (zone_id, client_key, secure_reading_ohms, secure_state, activated, passed, tested_at)
       select z.id, gen_random_uuid(), 2200, 'normal', true, true, now() - interval '800 days'
         from zones z`,
    );
    await db.raw(
      `insert into service_visits (site_id, kind, status, due_date, completed_at, plan_visits_per_year)
       select s.id, 'preventive', 'done', (now() - (g % 730) * interval '1 day')::date,
              now() - (g % 730) * interval '1 day', case when s.monitoring_centre_id is null then 1 else 2 end
         from (select id, monitoring_centre_id, row_number() over (order by reference) as g from sites) s
        where g % 5 <> 0`,
    );
    await db.raw(
      `insert into service_visits (site_id, kind, status, due_date, scheduled_for, plan_visits_per_year)
       select s.id, 'preventive', 'scheduled', (now() + (g % 56) * interval '1 day')::date,
              date_trunc('day', now()) + (g % 56) * interval '1 day' + interval '9 hours', 2
         from (select id, row_number() over (order by reference) as g from sites) s
        where g % 5 in (1, 2)`,
    );
    await db.raw('analyze');

    const today = ukDateOf(new Date());
    const overdue: number[] = [];
    let overdueCount = 0;
    for (let run = 0; run < RUNS; run++) {
      const { ms, result } = await timed(() => overdueSites(db, [installerId], today));
      overdue.push(ms);
      overdueCount = result.length;
    }
    console.log(
      `Overdue list over ${seeded.counts.sites} sites: ${median(overdue).toFixed(0)} ms (median of ${RUNS}; ${overdueCount} overdue)`,
    );

    const single: number[] = [];
    for (let run = 0; run < 200; run++)
      single.push((await timed(() => servicePlanForSite(db, seeded.siteId, today))).ms);
    console.log(`One site's plan: ${median(single).toFixed(2)} ms (median of 200)`);

    const weeks: number[] = [];
    let visits = 0;
    for (let run = 0; run < RUNS; run++) {
      const { ms, result } = await timed(() => schedule(db, [installerId], {}, today));
      weeks.push(ms);
      visits = result.visits.length;
    }
    console.log(
      `Schedule, the next four weeks: ${median(weeks).toFixed(0)} ms (median of ${RUNS}; ${visits} visits)`,
    );
  } finally {
    await db.destroy();
  }
} finally {
  await finish();
}
