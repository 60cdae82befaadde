import http from 'node:http';

export interface LoadResult {
  requests: number;
  errors: number;
  seconds: number;
  requestsPerSecond: number;
  p50Ms: number;
  p95Ms: number;
}

export function percentile(sorted: number[], fraction: number): number {
  if (sorted.length === 0) return 0;
  const index = Math.min(sorted.length - 1, Math.ceil(fraction * sorted.length) - 1);
  return sorted[Math.max(0, index)]!;
}

export const median = (values: number[]) =>
  percentile(
    [...values].sort((a, b) => a - b),
    0.5,
  );

/**
 * A closed-loop load: `connections` clients each send the next request as soon as the last
 * answered, over kept-alive sockets, for `seconds`. Every latency is kept, so p95 is exact.
 */
export async function load(options: {
  url: string;
  connections: number;
  seconds: number;
  headers?: Record<string, string>;
}): Promise<LoadResult> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: options.connections });
  const latencies: number[] = [];
  let errors = 0;
  const started = performance.now();
  const deadline = started + options.seconds * 1000;

  const once = () =>
    new Promise<void>((resolve) => {
      const begun = performance.now();
      const request = http.get(options.url, { agent, headers: options.headers }, (response) => {
        response.resume();
        response.on('end', () => {
          if (response.statusCode !== 200) errors++;
          latencies.push(performance.now() - begun);
          resolve();
        });
      });
      request.on('error', () => {
        errors++;
        resolve();
      });
    });

  await Promise.all(
    Array.from({ length: options.connections }, async () => {
      while (performance.now() < deadline) await once();
    }),
  );
  agent.destroy();
  const seconds = (performance.now() - started) / 1000;
  latencies.sort((a, b) => a - b);
  return {
    requests: latencies.length,
    errors,
    seconds,
    requestsPerSecond: latencies.length / seconds,
    p50Ms: percentile(latencies, 0.5),
    p95Ms: percentile(latencies, 0.95),
  };
}
