import { Worker } from 'node:worker_threads';
import type { ServiceReportSnapshot } from '../../service-report/schema';
import type { PackSnapshot } from '../snapshot';

type Pending = { resolve: (pdf: Buffer) => void; reject: (error: Error) => void };

let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, Pending>();

function failAll(error: Error) {
  for (const waiting of pending.values()) waiting.reject(error);
  pending.clear();
  worker = null;
}

function renderThread(): Worker {
  if (worker) return worker;
  // The worker is TypeScript like the rest of the server; its entry registers tsx first.
  const started = new Worker(new URL('./render-worker-boot.mjs', import.meta.url));
  started.on('message', (message: { id: number; pdf?: Uint8Array; error?: string }) => {
    const waiting = pending.get(message.id);
    if (!waiting) return;
    pending.delete(message.id);
    if (pending.size === 0) started.unref();
    if (message.pdf) waiting.resolve(Buffer.from(message.pdf));
    else waiting.reject(new Error(`the pack renderer failed: ${message.error}`));
  });
  started.on('error', (error) => failAll(error));
  started.on('exit', (code) => failAll(new Error(`the pack renderer stopped (exit ${code})`)));
  worker = started;
  return started;
}

/**
 * Draws a pack's PDF on the renderer thread, so the API stays responsive while it works.
 * Requests queue there one at a time.
 */
export function renderPackPdfOffThread(snapshot: PackSnapshot): Promise<Buffer> {
  return renderOffThread({ snapshot });
}

/** Draws a service report on the same thread, queued behind any pack being drawn. */
export function renderServiceReportPdfOffThread(serviceReport: ServiceReportSnapshot) {
  return renderOffThread({ serviceReport });
}

function renderOffThread(
  request: { snapshot: PackSnapshot } | { serviceReport: ServiceReportSnapshot },
): Promise<Buffer> {
  const id = nextId++;
  return new Promise<Buffer>((resolve, reject) => {
    pending.set(id, { resolve, reject });
    const thread = renderThread();
    // Held while it works, so a waiting render keeps the process alive; let go when idle.
    thread.ref();
    thread.postMessage({ id, ...request });
  });
}

/** Ends the renderer thread (tests and shutdown); the next render starts a new one. */
export async function stopPackRenderer() {
  const running = worker;
  worker = null;
  if (running) await running.terminate();
}
