import { signaturePng } from '../tests/setup/signature-png';
import {
  renderServiceReportPdfOffThread,
  stopPackRenderer,
} from '../server/handover/pdf/render-off-thread';
import { renderServiceReportPdf } from '../server/service-report/pdf/service-report';
import type { ServiceReportSnapshot } from '../server/service-report/schema';
import { median } from './lib/load';

/**
 * Issue 7's service report: how long one report takes to draw, on this thread and on the
 * renderer thread the handover pack uses, for a 40-zone system with two items not tested.
 * Prints figures; never passes or fails on them.
 *
 *   npx tsx bench/service-report.ts
 */
const RUNS = Number(process.env.BENCH_RUNS ?? 5);
const ZONES = 40;

function snapshot(): ServiceReportSnapshot {
  const zones = Array.from({ length: ZONES }, (_, index) => ({
    zoneId: `zone-${index + 1}`,
    number: index + 1,
    location: `Room ${index + 1}`,
    secureReadingOhms: 2200,
    secureOpen: false,
    secureState: 'normal' as const,
    alarmReadingOhms: 6900,
    alarmOpen: false,
    alarmState: 'alarm' as const,
    activated: true,
    passed: true,
    failures: [],
    note: '',
  }));
  return {
    reportId: 'bench',
    visit: {
      id: 'bench-visit',
      siteId: 'bench-site',
      siteReference: 'BENCH-1',
      siteName: 'Bench House',
      siteTown: 'Exampleton',
      kind: 'preventive',
      status: 'done',
      dueDate: '2027-06-01',
      scheduledFor: null,
      engineer: { id: 'bench-engineer', name: 'Bench Engineer' },
      planVisitsPerYear: 2,
      reportedFault: null,
      completedAt: '2027-05-28T10:30:00.000Z',
      version: 2,
      outcome: { passed: true, words: 'Everything tested passed.', findings: [] },
      preventive: {
        battery: {
          restingVolts: 13.1,
          loadTestVolts: 12.4,
          loadTestAmps: 1.5,
          passed: true,
          reasons: [],
          notes: [],
        },
        zones,
        tampers: { result: 'passed', note: '' },
        sounders: {
          internal: { result: 'passed', note: '' },
          external: { result: 'passed', note: '' },
        },
        signalling: [],
        userTrainingGiven: true,
        userConfidence: { score: 4, words: 'confident' },
        notTested: [
          {
            item: 'battery',
            zoneId: null,
            pathId: null,
            label: 'Battery',
            reason: 'Cupboard locked.',
          },
        ],
        note: '',
        outcome: { passed: true, words: 'Everything tested passed.', findings: [] },
      },
      corrective: null,
      customerSignedBy: 'Bench Customer',
      nextDueOn: '2027-11-28',
    },
    installer: { name: 'Bench Alarms Ltd' },
    site: {
      name: 'Bench House',
      reference: 'BENCH-1',
      addressLines: ['1 Bench Road'],
      hazards: '',
    },
    customerSignature: signaturePng(1),
    preparedAt: '2027-05-28T11:00:00.000Z',
  };
}

async function timed(render: () => Promise<Buffer>) {
  const times: number[] = [];
  let size = 0;
  for (let run = 0; run < RUNS; run++) {
    const started = performance.now();
    size = (await render()).length;
    times.push(performance.now() - started);
  }
  return { medianMs: median(times), size };
}

const report = snapshot();
// The first render loads fonts and warms the renderer; it is not counted.
await renderServiceReportPdf(report);
const inThread = await timed(() => renderServiceReportPdf(report));
await renderServiceReportPdfOffThread(report);
const offThread = await timed(() => renderServiceReportPdfOffThread(report));
await stopPackRenderer();
console.log(`service report, ${ZONES} zones, ${RUNS} runs (median):`);
console.log(
  `  drawn on this thread:     ${inThread.medianMs.toFixed(0)} ms, ${inThread.size} bytes`,
);
console.log(`  drawn on renderer thread: ${offThread.medianMs.toFixed(0)} ms`);
