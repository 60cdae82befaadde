import { randomUUID } from 'node:crypto';
import { createDb } from '../server/db/knex';
import { faultQueue } from '../server/faults/service';
import { completeVisit } from '../server/service/completion';
import { serviceHistory } from '../server/service-history/service';
import { falseAlarmRecord } from '../server/signal-history/service';
import { benchDatabase, timed } from './lib/database';
import { median } from './lib/load';
import { seedBenchData } from './records';

/**
 * Issue 7's visit forms and fault reports at product.md's scale for one company (5,000 sites,
 * 80,000 zones): completing a preventive visit (every zone classified, the power budget, the
 * plan), a resend of the same form, the office's fault queue, a home's service history and a
 * site's false-alarm record. Prints figures; never passes or fails on them.
 *
 *   npx tsx bench/service-visits.ts
 *
 * Runs on a throwaway database of its own, on the PostgreSQL the tests use.
 */
const RUNS = Number(process.env.BENCH_RUNS ?? 20);

// The demo seed is not wanted here: the bench company is the only one.
const { database: connection, finish } = await benchDatabase('visits');
try {
  const seeded = await seedBenchData(connection);
  const db = createDb(connection, 4);
  try {
    const site = await db('sites').where({ id: seeded.siteId }).first('installer_id');
    const installerId = site.installer_id as string;
    const [engineer] = await db('users')
      .insert({
        idp_subject: randomUUID(),
        email: 'bench.engineer@example.com',
        display_name: 'Bench Engineer',
      })
      .returning<{ id: string }[]>('id');
    await db('memberships').insert({
      user_id: engineer!.id,
      role: 'engineer',
      organisation_id: installerId,
    });
    // Three fault reports for one site in ten over the years, one in five of them still open,
    // and two years of done visits (two a year) on every site.
    await db.raw(
      `insert into fault_reports (site_id, description, status, created_at)
       select s.id, 'Bench fault ' || k, case when (g / 10 + k) % 5 = 0 then 'open' else 'closed' end,
              now() - ((g + k * 97) % 1000) * interval '1 day'
         from (select id, row_number() over (order by reference) as g from sites) s,
              generate_series(1, 3) k
        where g % 10 = 0`,
    );
    await db.raw(
      `insert into service_visits (site_id, kind, status, due_date, completed_at, checklist)
       select s.id, 'preventive', 'done', (now() - k * interval '6 months')::date,
              now() - k * interval '6 months',
              '{"outcome": {"passed": true, "words": "Every check passed.", "findings": []}}'
         from sites s, generate_series(1, 4) k`,
    );
    await db.raw('analyze');

    const zones = await db('zones as z')
      .join('systems as y', 'y.id', 'z.system_id')
      .where('y.site_id', seeded.siteId)
      .orderBy('z.position')
      .pluck('z.id');
    const form = () => ({
      kind: 'preventive' as const,
      clientKey: randomUUID(),
      completedAt: new Date(Date.now() - 60_000).toISOString(),
      battery: { restingVolts: 13.1, loadTestVolts: 12.4, loadTestAmps: 1.5 },
      zones: zones.map((zoneId: string) => ({
        zoneId,
        secureReading: 2200,
        alarmReading: 6900,
        activated: true,
        note: '',
      })),
      tampers: { result: 'passed' as const, note: '' },
      sounders: {
        internal: { result: 'passed' as const, note: '' },
        external: { result: 'passed' as const, note: '' },
      },
      signalling: [],
      userTrainingGiven: true,
      userConfidence: { score: 4, words: 'confident' as const },
      notTested: [],
      note: '',
    });
    const actor = { actorUserId: engineer!.id, actorLabel: 'Bench Engineer' };

    const completions: number[] = [];
    const resends: number[] = [];
    for (let run = 0; run < RUNS; run++) {
      const [visit] = await db('service_visits')
        .insert({ site_id: seeded.siteId, kind: 'preventive', due_date: db.raw('current_date') })
        .returning<{ id: string }[]>('id');
      const input = form();
      completions.push(
        (await timed(() => completeVisit(db, [installerId], visit!.id, input, actor, new Date())))
          .ms,
      );
      resends.push(
        (await timed(() => completeVisit(db, [installerId], visit!.id, input, actor, new Date())))
          .ms,
      );
    }
    console.log(
      `Completing a preventive visit (${zones.length} zones classified, power budget, plan): ${median(completions).toFixed(1)} ms (median of ${RUNS})`,
    );
    console.log(
      `The same form sent again (answered from the record): ${median(resends).toFixed(1)} ms (median of ${RUNS})`,
    );

    const queue: number[] = [];
    let queued = 0;
    for (let run = 0; run < RUNS; run++) {
      const { ms, result } = await timed(() => faultQueue(db, [installerId], { status: 'active' }));
      queue.push(ms);
      queued = result.faults.length;
    }
    console.log(
      `Office fault queue over ${seeded.counts.sites} sites: ${median(queue).toFixed(1)} ms (median of ${RUNS}; ${queued} open)`,
    );

    const history: number[] = [];
    let entries = 0;
    for (let run = 0; run < RUNS; run++) {
      const { ms, result } = await timed(() => serviceHistory(db, seeded.siteId));
      history.push(ms);
      entries = result.entries.length;
    }
    console.log(
      `A home's service history: ${median(history).toFixed(1)} ms (median of ${RUNS}; ${entries} entries)`,
    );

    const falseAlarms: number[] = [];
    for (let run = 0; run < RUNS; run++)
      falseAlarms.push((await timed(() => falseAlarmRecord(db, seeded.siteId))).ms);
    console.log(
      `A site's false-alarm record with reinstatement: ${median(falseAlarms).toFixed(1)} ms (median of ${RUNS})`,
    );
  } finally {
    await db.destroy();
  }
} finally {
  await finish();
}
