import autocannon, { type Request as CannonRequest } from 'autocannon';

/** One autocannon run, summarised. Latencies in ms. */
export interface LoadResult {
  readonly label: string;
  readonly rps: number;
  readonly p50: number;
  readonly p95: number;
  readonly p99: number;
  readonly errors: number;
  readonly total: number;
}

const pct = (sorted: readonly number[], p: number) =>
  sorted.length ? (sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))] ?? NaN) : NaN;

/**
 * Drives `url` with autocannon for `seconds` over `connections` keep-alive connections.
 * Errors are socket errors, timeouts and every answer outside 2xx. Latency percentiles are
 * computed from every response's own time (autocannon's histogram has no p95), or, for a
 * sequence (sign-in = csrf + login), from the step `timed` records itself.
 */
export async function load(opts: {
  label: string;
  url: string;
  connections: number;
  seconds: number;
  headers?: Record<string, string>;
  method?: 'GET' | 'POST' | 'PATCH';
  body?: string;
  requests?: CannonRequest[];
  timed?: number[];
}): Promise<LoadResult> {
  const times: number[] = [];
  let instance: autocannon.Instance | undefined;
  const done = new Promise<autocannon.Result>((resolve, reject) => {
    instance = autocannon(
      {
        url: opts.url,
        connections: opts.connections,
        duration: opts.seconds,
        ...(opts.headers ? { headers: opts.headers } : {}),
        ...(opts.method ? { method: opts.method } : {}),
        ...(opts.body ? { body: opts.body } : {}),
        ...(opts.requests ? { requests: opts.requests } : {}),
        timeout: 10,
      },
      (err, result) => (err ? reject(err) : resolve(result)),
    );
  });
  instance?.on('response', (_client: unknown, _status: number, _bytes: number, responseTime: number) => {
    times.push(responseTime);
  });
  const r = await done;
  const source = opts.timed ?? times;
  const sorted = [...source].sort((a, b) => a - b);
  const non2xx = r.non2xx ?? 0;
  const divisor = opts.requests && opts.timed ? opts.requests.length : 1;
  return {
    label: opts.label,
    rps: r.requests.total / divisor / opts.seconds,
    p50: pct(sorted, 50),
    p95: pct(sorted, 95),
    p99: pct(sorted, 99),
    errors: r.errors + r.timeouts + non2xx,
    total: r.requests.total / divisor,
  };
}
