import { afterEach, describe, expect, it, vi } from 'vitest';
import { z } from 'zod';
import { preloadRoute } from '../../client/src/app/route-preload';
import { apiFetch, clearCsrfToken } from '../../client/src/lib/api-client';
import { ApiError } from '../../client/src/lib/api-error';
import { fetchEarly, forgetEarly, takeEarly } from '../../client/src/lib/early-fetch';
import { json, mockFetch, problem } from './helpers/fetch-mock';

const n = z.object({ n: z.number() });

afterEach(() => {
  forgetEarly();
  clearCsrfToken();
  vi.useRealTimers();
  vi.unstubAllGlobals();
});

describe('reads the entry asks for early (issue 11)', () => {
  it('apiFetch takes the early answer once, parsed as any other, and asks the server for the next read', async () => {
    const fetch = mockFetch({ 'GET /api/thing': (_init, call) => json(200, { n: call }) });
    fetchEarly('/api/thing');
    expect(fetch).toHaveBeenCalledTimes(1);
    await expect(apiFetch('/api/thing', { schema: n })).resolves.toEqual({ n: 1 });
    expect(fetch).toHaveBeenCalledTimes(1);
    await expect(apiFetch('/api/thing', { schema: n })).resolves.toEqual({ n: 2 });
    expect(fetch).toHaveBeenCalledTimes(2);
  });

  it('an early 401 is the same error a late one would be', async () => {
    mockFetch({ 'GET /api/jobs/j1': problem(401, 'unauthenticated', 'Sign in to continue.') });
    fetchEarly('/api/jobs/j1');
    const e = await apiFetch('/api/jobs/j1').catch((x: unknown) => x);
    expect(e).toBeInstanceOf(ApiError);
    expect((e as ApiError).status).toBe(401);
  });

  it('never stands in for a read made after a write from this tab', async () => {
    const fetch = mockFetch({
      'GET /api/thing': (_init, call) => json(200, { n: call }),
      'GET /api/auth/csrf': json(200, { token: 't' }),
      'POST /api/thing': json(201, {}),
    });
    fetchEarly('/api/thing');
    await apiFetch('/api/thing', { method: 'POST', body: {} });
    await expect(apiFetch('/api/thing', { schema: n })).resolves.toEqual({ n: 2 });
    expect(
      fetch.mock.calls.filter(([url, init]) => url === '/api/thing' && (init?.method ?? 'GET') === 'GET'),
    ).toHaveLength(2);
  });

  it('is not taken once it is more than 10 s old', () => {
    vi.useFakeTimers();
    mockFetch({ 'GET /api/thing': json(200, { n: 1 }) });
    fetchEarly('/api/thing');
    vi.advanceTimersByTime(10_001);
    expect(takeEarly('/api/thing')).toBeUndefined();
  });

  it('the walk-through and loads pages ask for the session, the job, its rooms and the settings; others ask nothing', () => {
    const fetch = mockFetch({
      'GET /api/auth/session': json(200, { me: null }),
      'GET /api/jobs/j%201': json(200, {}),
      'GET /api/jobs/j%201/rooms': json(200, {}),
      'GET /api/company/settings': json(200, {}),
    });
    preloadRoute('/jobs/new');
    preloadRoute('/settings');
    expect(fetch).not.toHaveBeenCalled();
    preloadRoute('/jobs/j%201/loads');
    expect(fetch.mock.calls.map(([url]) => url).sort()).toEqual([
      '/api/auth/session',
      '/api/company/settings',
      '/api/jobs/j%201',
      '/api/jobs/j%201/rooms',
    ]);
  });
});
