import { parentPort } from 'node:worker_threads';
import type { PackSnapshot } from '../snapshot';
import type { ServiceReportSnapshot } from '../../service-report/schema';
import { renderServiceReportPdf } from '../../service-report/pdf/service-report';
import { renderPackPdf } from './render-pack';

/**
 * The pack renderer's own thread: a 40-zone pack holds the event loop for seconds, which in the
 * API process would stall every other request. Renders run one at a time (react-pdf's renderer
 * does not survive two overlapping renders in one thread), so service reports are drawn here too.
 */
let queue: Promise<unknown> = Promise.resolve();

type RenderRequest =
  { id: number; snapshot: PackSnapshot } | { id: number; serviceReport: ServiceReportSnapshot };

parentPort!.on('message', (message: RenderRequest) => {
  queue = queue.then(async () => {
    try {
      const pdf =
        'serviceReport' in message
          ? await renderServiceReportPdf(message.serviceReport)
          : await renderPackPdf(message.snapshot);
      parentPort!.postMessage({ id: message.id, pdf });
    } catch (error) {
      parentPort!.postMessage({
        id: message.id,
        error: error instanceof Error ? (error.stack ?? error.message) : String(error),
      });
    }
  });
});
