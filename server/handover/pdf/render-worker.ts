import { parentPort } from 'node:worker_threads';
import type { PackSnapshot } from '../snapshot';
import { renderPackPdf } from './render-pack';

/**
 * The pack renderer's own thread: a 40-zone pack holds the event loop for seconds, which in the
 * API process would stall every other request. Renders run one at a time (react-pdf's renderer
 * does not survive two overlapping renders in one thread).
 */
let queue: Promise<unknown> = Promise.resolve();

parentPort!.on('message', (message: { id: number; snapshot: PackSnapshot }) => {
  queue = queue.then(async () => {
    try {
      const pdf = await renderPackPdf(message.snapshot);
      parentPort!.postMessage({ id: message.id, pdf });
    } catch (error) {
      parentPort!.postMessage({
        id: message.id,
        error: error instanceof Error ? (error.stack ?? error.message) : String(error),
      });
    }
  });
});
