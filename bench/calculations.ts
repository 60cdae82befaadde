import { classifyReading, type LoopDesign } from '../server/calc/loop';
import { E24 } from '../server/calc/preferred-values';
import { createDb, type DatabaseConnection } from '../server/db/knex';
import { computePower, powerItems } from '../server/engineering/site-engineering';
import type { SystemRow } from '../server/systems/repository';
import type { Zone } from '../server/zones/schema';
import type { Device } from '../server/devices/schema';
import { median } from './lib/load';

/**
 * Issue 4's benchmark: loop-reading classifications per second (pure calculation, one core),
 * and a power budget for every system in the 80,000-zone bench data (load, then compute).
 */
function seededRandom(seed: number) {
  let state = seed >>> 0;
  return () => {
    state = (state * 1664525 + 1013904223) >>> 0;
    return state / 4294967296;
  };
}

function classificationsPerSecond(): number {
  const random = seededRandom(42);
  const pick = () =>
    Math.round(
      E24[Math.floor(random() * E24.length)]! * [100, 1000, 10_000][Math.floor(random() * 3)]!,
    );
  const designs: LoopDesign[] = Array.from({ length: 1000 }, () => ({
    wiring: 'two_resistor',
    tamperOhms: pick(),
    alarmOhms: pick(),
    tolerance: 0.05,
    cableOhms: { min: 0, max: random() * 30 },
  }));
  const readings = Array.from({ length: 1000 }, () => random() * 30_000);
  let count = 0;
  const started = performance.now();
  while (performance.now() - started < 1000) {
    for (let i = 0; i < 1000; i++) {
      classifyReading(designs[i]!, readings[(i * 7 + count) % 1000]!);
      count++;
    }
  }
  return count / ((performance.now() - started) / 1000);
}

export async function benchCalculations(database: DatabaseConnection) {
  const rates = [
    classificationsPerSecond(),
    classificationsPerSecond(),
    classificationsPerSecond(),
  ];
  console.log(
    `loop-reading classifications: ${Math.round(median(rates)).toLocaleString('en-GB')} per second (median of 3, one core)`,
  );

  const db = createDb(database, 4);
  const loads: number[] = [];
  const computes: number[] = [];
  let summary = '';
  for (let run = 0; run < 3; run++) {
    const loadStarted = performance.now();
    const [systems, zoneRows, deviceRows, sites] = await Promise.all([
      db<SystemRow>('systems').select('*'),
      db('zones').select('system_id', 'number', 'location', 'quiescent_ma', 'alarm_ma'),
      db('devices').select('system_id', 'kind', 'location', 'quiescent_ma', 'alarm_ma'),
      db('sites').select('id', 'required_grade'),
    ]);
    loads.push(performance.now() - loadStarted);

    const computeStarted = performance.now();
    const zonesBySystem = new Map<string, Zone[]>();
    for (const row of zoneRows) {
      const list = zonesBySystem.get(row.system_id) ?? [];
      list.push({
        number: row.number,
        location: row.location,
        quiescentMa: row.quiescent_ma === null ? null : Number(row.quiescent_ma),
        alarmMa: row.alarm_ma === null ? null : Number(row.alarm_ma),
      } as Zone);
      zonesBySystem.set(row.system_id, list);
    }
    const devicesBySystem = new Map<string, Device[]>();
    for (const row of deviceRows) {
      const list = devicesBySystem.get(row.system_id) ?? [];
      list.push({
        kind: row.kind,
        location: row.location,
        quiescentMa: row.quiescent_ma === null ? null : Number(row.quiescent_ma),
        alarmMa: row.alarm_ma === null ? null : Number(row.alarm_ma),
      } as Device);
      devicesBySystem.set(row.system_id, list);
    }
    const gradeOf = new Map(
      sites.map((site: { id: string; required_grade: number }) => [site.id, site.required_grade]),
    );
    let passing = 0;
    let failing = 0;
    for (const system of systems) {
      const result = computePower(
        system,
        gradeOf.get(system.site_id) ?? 2,
        powerItems(
          system,
          zonesBySystem.get(system.id) ?? [],
          devicesBySystem.get(system.id) ?? [],
        ),
      );
      if (result.available && result.passes) passing++;
      else failing++;
    }
    computes.push(performance.now() - computeStarted);
    summary = `${systems.length} systems, ${zoneRows.length} zones, ${deviceRows.length} devices: ${passing} batteries big enough, ${failing} not`;
  }
  await db.destroy();
  console.log(`power budget for every system (${summary}):`);
  console.log(
    `  load ${median(loads).toFixed(0)} ms, compute ${median(computes).toFixed(0)} ms (medians of 3)`,
  );
}
