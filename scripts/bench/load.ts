/**
 * autocannon with every response time recorded, so that p50/p95/p99 are exact rather than
 * autocannon's fixed percentile buckets.
 */
import autocannon from 'autocannon';

export type LoadResult = {
  requests: number;
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  non2xx: number;
};

/** The q-quantile of sorted values (nearest rank). */
export function quantile(sorted: number[], q: number): number {
  if (!sorted.length) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)];
}

/** Runs autocannon and summarises it. */
export function load(opts: autocannon.Options): Promise<LoadResult> {
  const times: number[] = [];
  return new Promise((resolve, reject) => {
    const instance = autocannon(opts, (err, result) => {
      if (err) return reject(err);
      times.sort((a, b) => a - b);
      resolve({
        requests: result.requests.total,
        rps: result.requests.total / (result.duration || 1),
        p50: quantile(times, 0.5),
        p95: quantile(times, 0.95),
        p99: quantile(times, 0.99),
        errors: result.errors + result.timeouts,
        non2xx: result.non2xx,
      });
    });
    instance.on('response', (_client: unknown, _status: number, _bytes: number, ms: number) => {
      times.push(ms);
    });
  });
}

/** One line of a report. */
export function describe(name: string, r: LoadResult): string {
  return `${name.padEnd(36)} ${r.rps.toFixed(0).padStart(6)} req/s  p50 ${r.p50.toFixed(1)} ms  p95 ${r.p95.toFixed(1)} ms  p99 ${r.p99.toFixed(1)} ms  errors ${r.errors}  non-2xx ${r.non2xx}`;
}
