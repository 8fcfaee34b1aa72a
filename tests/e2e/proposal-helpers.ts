import type { Page } from 'playwright-core';
import { expect } from 'vitest';

/** Shared by the proposal journeys (issue 14). */

/** A JSON call in the page's own session (CSRF from the session, as the app sends it); fails the test unless 2xx. */
export async function api(page: Page, method: 'post' | 'get', path: string, body?: unknown) {
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const res = await page.request.fetch(path, {
    method,
    headers: { 'X-CSRF-Token': csrf, 'Content-Type': 'application/json' },
    data: body === undefined ? undefined : JSON.stringify(body),
  });
  const text = await res.text();
  expect(res.ok(), `${method} ${path}: ${res.status()} ${text}`).toBe(true);
  return text ? (JSON.parse(text) as Record<string, unknown>) : {};
}
