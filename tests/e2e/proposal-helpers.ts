import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { PROPOSAL_LINK_OPEN_PATH } from '@contract';
import { account, jobWithRooms } from './desk-helpers';
import { DESKTOP, PHONE, signIn, type E2E } from './harness';

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

/** Asks `read` every 100 ms until it gives a value (30 s at most). */
export async function until<T>(what: string, read: () => Promise<T | undefined>): Promise<T> {
  for (let i = 0; i < 300; i += 1) {
    const found = await read();
    if (found !== undefined) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`gave up waiting for ${what}`);
}

/** A demo job with one priced option asking a 10 % deposit, marked ready, issued and e-mailed: the link's path. */
export async function sentProposal(e: E2E, office: Page): Promise<{ jobId: string; path: string }> {
  const jobId = await jobWithRooms(office);
  const rooms = (await api(office, 'get', `/api/jobs/${jobId}/rooms`)).rooms as { id: string }[];
  await api(office, 'post', `/api/jobs/${jobId}/options`, {
    name: 'Quiet comfort',
    design: {
      zones: [{ key: 'z1', name: 'Main room', roomIds: [rooms[0]?.id ?? ''], indoorUnitKey: 'TSL-S12H-W' }],
      systems: [
        {
          key: 's1',
          name: 'Main system',
          outdoorUnitKey: 'TSL-S12H-O',
          circuits: [{ zoneKey: 'z1', lengthFt: 25 }],
          electrical: { circuitLengthFt: 40 },
        },
      ],
    },
    pricing: { deposit: { kind: 'percent', value: 10 } },
  });
  await api(office, 'post', `/api/jobs/${jobId}/ready`, {
    sizingOverride: { reason: 'The family wants the main room done first.' },
  });
  await api(office, 'post', `/api/jobs/${jobId}/proposal/versions`);
  const to = `buyer-${Date.now()}@example.com`;
  await api(office, 'post', `/api/jobs/${jobId}/proposal/links`, { to });
  const mail = await until('the proposal e-mail', async () => e.smtp.messages.find((m) => m.to.includes(to)));
  const link = new RegExp(`https?://\\S+${PROPOSAL_LINK_OPEN_PATH}\\?t=[A-Za-z0-9_-]{43}`).exec(mail.text)?.[0];
  if (!link) throw new Error(`no proposal link in: ${mail.text}`);
  return { jobId, path: new URL(link).pathname + new URL(link).search };
}

/**
 * The estimator signed in at the desk sends a proposal (sentProposal), and the customer opens the e-mailed link on a
 * phone: both pages, the job and the link's path (for a later visit).
 */
export async function customerOnPhone(e: E2E) {
  const office = await e.newPage(DESKTOP);
  const estimator = account('estimator');
  await signIn(office.page, estimator.email, estimator.password);
  await office.page.getByTestId('user-name').first().waitFor();
  const { jobId, path } = await sentProposal(e, office.page);
  const phone = await e.newPage(PHONE);
  await phone.page.goto(path);
  await phone.page.getByRole('heading', { name: /^Your proposal,/ }).waitFor();
  return { office, phone, jobId, path };
}
