import { vi } from 'vitest';

type Reply = { status?: number; body?: unknown; headers?: Record<string, string> };
type Handler = Reply | ((init: RequestInit | undefined, call: number) => Reply);

export function json(status: number, body: unknown, headers: Record<string, string> = {}): Reply {
  return { status, body, headers: { 'Content-Type': 'application/json', ...headers } };
}

export function problem(
  status: number,
  code: string,
  detail: string,
  extra: Record<string, unknown> = {},
  headers: Record<string, string> = {},
): Reply {
  return {
    status,
    body: { type: `/problems/${code}`, title: code, status, detail, ...extra },
    headers: { 'Content-Type': 'application/problem+json', ...headers },
  };
}

/** A fetch stand-in answering "METHOD /path" keys; anything else is a test failure. */
export function mockFetch(handlers: Record<string, Handler>) {
  const calls = new Map<string, number>();
  const fn = vi.fn(async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const key = `${init?.method ?? 'GET'} ${url}`;
    const handler = handlers[key];
    if (!handler) throw new Error(`Unexpected fetch: ${key}`);
    const n = (calls.get(key) ?? 0) + 1;
    calls.set(key, n);
    const reply = typeof handler === 'function' ? handler(init, n) : handler;
    const status = reply.status ?? 200;
    const body = reply.body === undefined || status === 204 ? null : JSON.stringify(reply.body);
    return new Response(body, { status, headers: reply.headers ?? { 'Content-Type': 'application/json' } });
  });
  vi.stubGlobal('fetch', fn);
  return fn;
}

export function headerOf(init: RequestInit | undefined, name: string): string | undefined {
  const h = init?.headers;
  if (!h || h instanceof Headers || Array.isArray(h)) return undefined;
  return h[name];
}
