import v8 from 'node:v8';
import vm from 'node:vm';
import { Worker } from 'node:worker_threads';
import { renderPackPdf } from '../server/handover/pdf/render-pack';
import { packSnapshotFixture } from '../tests/setup/pack-snapshot-fixture';
import { median } from './lib/load';

/**
 * The handover pack PDF for a 40-zone site: build time (median of BENCH_PACK_RUNS builds after
 * a warm-up), file size, memory while building, and ten packs asked for at once. Prints
 * figures only.
 */
const ZONES = 40;
const RUNS = Math.max(5, Number(process.env.BENCH_PACK_RUNS ?? 7));
const AT_ONCE = 10;

/**
 * A full garbage collection, so "heap growth" means memory still held after the builds and
 * not garbage not yet collected. `npm run bench` does not start node with --expose-gc.
 */
function collectGarbage(): void {
  v8.setFlagsFromString('--expose-gc');
  (vm.runInNewContext('gc') as () => void)();
}

const mib = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MiB`;
const kib = (bytes: number) => `${(bytes / 1024).toFixed(1)} KiB`;
const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

/**
 * Samples the process's resident set every 10 ms from a worker thread: rendering keeps the
 * main thread busy for long stretches, so a timer there would miss the peaks. RSS is the
 * whole process's, whichever thread reads it.
 */
function rssSampler() {
  const worker = new Worker(
    `const { parentPort } = require('node:worker_threads');
     let peak = 0;
     const sample = () => { peak = Math.max(peak, process.memoryUsage.rss()); };
     const timer = setInterval(sample, 10);
     parentPort.on('message', (message) => {
       sample();
       parentPort.postMessage(peak);
       if (message === 'reset') peak = 0;
       if (message === 'stop') { clearInterval(timer); parentPort.close(); }
     });`,
    { eval: true },
  );
  const ask = (message: 'peak' | 'reset' | 'stop') =>
    new Promise<number>((resolve) => {
      worker.once('message', resolve);
      worker.postMessage(message);
    });
  return {
    /** The peak since the last reset, then starts a new window. */
    takePeak: () => ask('reset'),
    stop: async () => {
      await ask('stop');
      await worker.terminate();
    },
  };
}

/** The main thread's heap, sampled whenever the event loop gets a turn. */
function heapSampler() {
  let peak = process.memoryUsage().heapUsed;
  const sample = () => {
    peak = Math.max(peak, process.memoryUsage().heapUsed);
  };
  const timer = setInterval(sample, 10);
  return {
    takePeak: () => {
      sample();
      const value = peak;
      peak = process.memoryUsage().heapUsed;
      return value;
    },
    stop: () => clearInterval(timer),
  };
}

export async function benchPack(): Promise<void> {
  const snapshot = packSnapshotFixture({ zones: ZONES });
  console.log(`\nHandover pack PDF (${ZONES} zones, ${RUNS} builds after a warm-up, medians)`);

  const rss = rssSampler();
  const heap = heapSampler();
  const startRss = process.memoryUsage().rss;

  let started = performance.now();
  const first = await renderPackPdf(snapshot);
  const warmUpMs = performance.now() - started;
  collectGarbage();
  const afterWarmUp = process.memoryUsage();
  await rss.takePeak();
  heap.takePeak();

  const times: number[] = [];
  let size = first.length;
  for (let run = 0; run < RUNS; run++) {
    started = performance.now();
    size = (await renderPackPdf(snapshot)).length;
    times.push(performance.now() - started);
  }
  const sequentialRss = await rss.takePeak();
  const sequentialHeap = heap.takePeak();
  collectGarbage();
  const afterSequential = process.memoryUsage();

  started = performance.now();
  const packs = await Promise.all(Array.from({ length: AT_ONCE }, () => renderPackPdf(snapshot)));
  const atOnceMs = performance.now() - started;
  const atOnceRss = await rss.takePeak();
  const atOnceHeap = heap.takePeak();
  collectGarbage();
  const afterAtOnce = process.memoryUsage();
  await rss.stop();
  heap.stop();

  const sorted = [...times].sort((a, b) => a - b);
  console.log(`first build (fonts, code warm-up):     ${seconds(warmUpMs)}`);
  console.log(`median build:                          ${seconds(median(times))}`);
  console.log(
    `  builds: ${times.map((ms) => (ms / 1000).toFixed(2)).join(', ')} s (fastest ${seconds(sorted[0]!)}, slowest ${seconds(sorted.at(-1)!)})`,
  );
  console.log(`file size:                             ${kib(size)} (${size} bytes)`);
  console.log(
    `peak RSS, one build at a time:         ${mib(sequentialRss)} (process at start ${mib(startRss)})`,
  );
  console.log(
    `heap used: after warm-up ${mib(afterWarmUp.heapUsed)}, peak during builds ${mib(sequentialHeap)}, ` +
      `after builds and a full GC ${mib(afterSequential.heapUsed)} (growth ${mib(afterSequential.heapUsed - afterWarmUp.heapUsed)})`,
  );
  console.log(
    `${AT_ONCE} packs at once (Promise.all):       ${seconds(atOnceMs)} wall, ` +
      `${seconds(atOnceMs / AT_ONCE)} a pack, ${packs.length} files`,
  );
  console.log(
    `  peak RSS ${mib(atOnceRss)}, peak heap used ${mib(atOnceHeap)}; ` +
      `after a full GC ${mib(afterAtOnce.heapUsed)} (growth over warm-up ${mib(afterAtOnce.heapUsed - afterWarmUp.heapUsed)})`,
  );
}
