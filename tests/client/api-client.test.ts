import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { apiFetch, clearCsrfToken } from '../../client/src/lib/api-client';
import { ApiError } from '../../client/src/lib/api-error';
import { headerOf, json, mockFetch, problem } from './helpers/fetch-mock';

beforeEach(() => clearCsrfToken());
afterEach(() => vi.unstubAllGlobals());

async function caught(p: Promise<unknown>): Promise<ApiError> {
  try {
    await p;
  } catch (e) {
    if (e instanceof ApiError) return e;
    throw e;
  }
  throw new Error('expected the request to fail');
}

describe('api client', () => {
  it('parses a JSON body with the given schema and sends same-origin credentials', async () => {
    const fetch = mockFetch({ 'GET /api/thing': json(200, { n: 3 }) });
    await expect(apiFetch('/api/thing', { schema: z.object({ n: z.number() }) })).resolves.toEqual({ n: 3 });
    expect(fetch.mock.calls[0]?.[1]?.credentials).toBe('same-origin');
    expect(headerOf(fetch.mock.calls[0]?.[1], 'X-CSRF-Token')).toBeUndefined();
  });

  it('sends the CSRF token on every non-GET and fetches it only once', async () => {
    const fetch = mockFetch({
      'GET /api/auth/csrf': json(200, { token: 'tok-1' }),
      'POST /api/things': json(201, { ok: true }),
      'PATCH /api/things/1': json(200, { ok: true }),
    });
    await apiFetch('/api/things', { method: 'POST', body: { a: 1 } });
    await apiFetch('/api/things/1', { method: 'PATCH', body: { a: 2 } });
    const writes = fetch.mock.calls.filter(([, init]) => init?.method !== 'GET');
    expect(writes.map(([, init]) => headerOf(init, 'X-CSRF-Token'))).toEqual(['tok-1', 'tok-1']);
    expect(headerOf(writes[0]?.[1], 'Content-Type')).toBe('application/json');
    expect(writes[0]?.[1]?.body).toBe('{"a":1}');
    expect(fetch.mock.calls.filter(([url]) => url === '/api/auth/csrf')).toHaveLength(1);
  });

  it('refetches the token and retries once after a 403 csrf problem', async () => {
    let token = 0;
    const fetch = mockFetch({
      'GET /api/auth/csrf': () => json(200, { token: `tok-${++token}` }),
      'POST /api/things': (init) =>
        headerOf(init, 'X-CSRF-Token') === 'tok-2'
          ? json(201, { ok: true })
          : problem(403, 'csrf', 'The request is missing a valid X-CSRF-Token header.'),
    });
    await expect(apiFetch('/api/things', { method: 'POST', body: {} })).resolves.toEqual({ ok: true });
    expect(fetch).toHaveBeenCalledTimes(4);
  });

  it('does not retry a second time when the fresh token is refused too', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 'tok' }),
      'POST /api/things': problem(403, 'csrf', 'Bad token'),
    });
    const err = await caught(apiFetch('/api/things', { method: 'POST', body: {} }));
    expect(err.code).toBe('csrf');
  });

  it('turns application/problem+json into ApiError with field errors', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 'tok' }),
      'POST /api/users': problem(400, 'validation', 'Some fields need attention.', {
        title: 'Invalid request',
        errors: [{ path: 'email', message: 'Enter a valid e-mail address.' }],
      }),
    });
    const err = await caught(apiFetch('/api/users', { method: 'POST', body: {} }));
    expect(err).toMatchObject({
      status: 400,
      code: 'validation',
      title: 'Invalid request',
      detail: 'Some fields need attention.',
      errors: [{ path: 'email', message: 'Enter a valid e-mail address.' }],
    });
  });

  it('reads Retry-After on a 429', async () => {
    mockFetch({
      'GET /api/auth/csrf': json(200, { token: 'tok' }),
      'POST /api/auth/login': problem(
        429,
        'rate-limited',
        'Too many attempts. Try again in 42 seconds.',
        {},
        { 'Retry-After': '42' },
      ),
    });
    const err = await caught(apiFetch('/api/auth/login', { method: 'POST', body: {} }));
    expect(err.status).toBe(429);
    expect(err.retryAfter).toBe(42);
  });

  it('gives a readable error for a non-JSON failure and for no connection', async () => {
    mockFetch({ 'GET /api/a': { status: 502, body: undefined, headers: { 'Content-Type': 'text/html' } } });
    const bad = await caught(apiFetch('/api/a'));
    expect(bad.status).toBe(502);
    expect(bad.detail).toMatch(/Try again/);

    vi.stubGlobal(
      'fetch',
      vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))),
    );
    const offline = await caught(apiFetch('/api/a'));
    expect(offline).toMatchObject({ status: 0, code: 'network' });
  });

  it('returns undefined for 204 No Content', async () => {
    mockFetch({ 'GET /api/auth/csrf': json(200, { token: 'tok' }), 'POST /api/auth/logout': { status: 204 } });
    await expect(apiFetch('/api/auth/logout', { method: 'POST' })).resolves.toBeUndefined();
  });
});
