import type { z } from 'zod';

/**
 * Parses route params or search params with zod. A bad value is a page that does not exist,
 * so it throws a 404 Response for the route's error boundary — never a cast.
 */
export function parseParams<S extends z.ZodType>(schema: S, params: unknown): z.output<S> {
  const r = schema.safeParse(params);
  if (!r.success) throw new Response('Not found', { status: 404, statusText: 'Not found' });
  return r.data;
}

export function searchParamsObject(search: URLSearchParams | string): Record<string, string> {
  return Object.fromEntries(new URLSearchParams(search));
}
