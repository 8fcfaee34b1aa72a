import { randomUUID } from 'node:crypto';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { sampleRoom } from '../server/jobs-helpers';
import { expectNoSeriousViolations } from './axe';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

/**
 * Opens with no signal: the production build's service worker keeps the shell and assets, the
 * query cache is saved per person, so a walk-through visited before reloads with the network cut,
 * takes a new room, and the room reaches the server once the network is back.
 */
let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const salesperson = demoAccounts.find((a) => a.role === 'salesperson' && a.company.startsWith('Larkspur'));
const owner = demoAccounts.find((a) => a.role === 'owner' && a.company.startsWith('Larkspur'));
/**
 * Full-page screenshots are for people to look at, not checks. With the network cut and the other e2e files running
 * beside this one on two cores, one took longer than the 15 s action timeout (a clean-clone CI run); alone it takes
 * about a second. Give them room rather than fail the journey on a slow capture.
 */
const SHOT_TIMEOUT = 45_000;

const pill = (page: Page) =>
  page.getByRole('status').filter({ hasText: /Saved|Saving|Offline|Not saved|Needs your choice/ });

/** A job of the salesperson's own, made through the API as the app would. */
async function newJob(page: Page, tag: string): Promise<string> {
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const headers = { 'X-CSRF-Token': csrf };
  const customer = await page.request.post('/api/customers', {
    headers,
    data: { name: `Basil Offline-${tag}`, email: `basil-${tag}@example.com` },
  });
  expect(customer.status()).toBe(201);
  const customerId = ((await customer.json()) as { customer: { id: string } }).customer.id;
  const job = await page.request.post('/api/jobs', {
    headers,
    data: { customerId, street: '9 Cellar Steps', city: 'Testerby', region: 'Demo State', postalCode: '00009' },
  });
  expect(job.status()).toBe(201);
  return ((await job.json()) as { job: { id: string } }).job.id;
}

/** The saved query cache of this person holds the job (written at most once a second). */
async function cacheHolds(page: Page, jobId: string): Promise<boolean> {
  return page.evaluate(async (id) => {
    const dbs = await indexedDB.databases();
    const name = dbs.map((d) => d.name ?? '').find((n) => n.startsWith('gaugeline-cache:'));
    if (!name) return false;
    return new Promise<boolean>((resolve) => {
      const open = indexedDB.open(name);
      open.onerror = () => resolve(false);
      open.onsuccess = () => {
        const db = open.result;
        if (!db.objectStoreNames.contains('queries')) return resolve(false);
        const get = db.transaction('queries').objectStore('queries').get('queries');
        // Held means the walk-through's own two queries were saved with their data (the job and its
        // rooms), not merely that the id appears somewhere in what was saved.
        get.onsuccess = () => {
          if (typeof get.result !== 'string') return resolve(false);
          const saved = JSON.parse(get.result) as {
            clientState?: { queries?: { queryKey: unknown; state: { status: string } }[] };
          };
          const held = new Set(
            (saved.clientState?.queries ?? [])
              .filter((q) => q.state.status === 'success')
              .map((q) => JSON.stringify(q.queryKey)),
          );
          resolve(
            held.has(JSON.stringify(['jobs', 'detail', id])) &&
              held.has(JSON.stringify(['jobs', 'detail', id, 'rooms'])),
          );
        };
        get.onerror = () => resolve(false);
      };
    });
  }, jobId);
}

describe('the app opens with no signal', () => {
  it('reloads a walk-through visited before with the network cut, takes a room, and sends it when back', async () => {
    if (!salesperson) throw new Error('no demo salesperson');
    const { context, page } = await e.newPage(PHONE, { serviceWorkers: 'allow' });
    // What the page said, printed only if the journey fails.
    const trail: string[] = [];
    page.on('console', (m) => trail.push(`console.${m.type()}: ${m.text()}`));
    page.on('pageerror', (err) => trail.push(`page error: ${err.message}`));
    onTestFailed(async () => {
      console.log(`the page during the journey:\n${trail.join('\n')}`);
      await page.screenshot({ path: `${SHOTS}/offline-failed-375.png`, fullPage: true }).catch(() => undefined);
    });
    await signIn(page, salesperson.email, salesperson.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const tag = randomUUID().slice(0, 6);
    const jobId = await newJob(page, tag);

    // Visit the walk-through once with signal; the service worker installs from the built client.
    await page.goto(`/jobs/${jobId}`);
    await page.getByRole('button', { name: 'Add room' }).waitFor();
    await expectNoSeriousViolations(page);
    const worker = await page.evaluate(async () => {
      const reg = await navigator.serviceWorker.ready;
      return reg.active?.scriptURL ?? '';
    });
    expect(new URL(worker).pathname).toBe('/sw.js');
    // The first visit is not yet controlled by the worker; the next load is.
    await page.reload();
    await page.getByRole('button', { name: 'Add room' }).waitFor();
    expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL ?? '')).toMatch(/\/sw\.js$/);
    await expect.poll(() => cacheHolds(page, jobId), { timeout: 15_000 }).toBe(true);

    // No signal: reload, the walk-through opens from the device.
    await context.setOffline(true);
    await page.reload();
    await page.getByRole('button', { name: 'Add room' }).waitFor({ timeout: 20_000 });
    await expect(page.getByText(`Basil Offline-${tag}`).first().isVisible()).resolves.toBe(true);
    await page.getByLabel('Room template').selectOption({ index: 1 });
    await page.getByRole('button', { name: 'Add room' }).click();
    await page.getByLabel('Room name').fill(`Cellar den ${tag}`);
    await pill(page)
      .filter({ hasText: /Offline — \d+ changes? waiting/ })
      .waitFor({ timeout: 20_000 });
    await page.screenshot({ path: `${SHOTS}/offline-reload-375.png`, fullPage: true, timeout: SHOT_TIMEOUT });
    await expectNoSeriousViolations(page);

    // Signal again: the room lands on the server.
    await context.setOffline(false);
    await pill(page)
      .filter({ hasText: /^\s*Saved\s*$/ })
      .waitFor({ timeout: 30_000 });
    await expect
      .poll(
        async () => {
          const res = await page.request.get(`/api/jobs/${jobId}/rooms`);
          const body = (await res.json()) as { rooms: Array<{ input: { name: string } }> };
          return body.rooms.map((r) => r.input.name);
        },
        { timeout: 20_000 },
      )
      .toContain(`Cellar den ${tag}`);
    await context.close();
  });

  it('a change made elsewhere while this phone had no signal: the panel says which device, when and by whom', async () => {
    if (!salesperson || !owner) throw new Error('no demo salesperson or owner');
    const { context, page } = await e.newPage(PHONE);
    await signIn(page, salesperson.email, salesperson.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const tag = randomUUID().slice(0, 6);
    const jobId = await newJob(page, tag);
    const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const made = await page.request.post(`/api/jobs/${jobId}/rooms`, {
      headers: { 'X-CSRF-Token': csrf },
      data: { input: sampleRoom(`Bedroom ${tag}`) },
    });
    expect(made.status()).toBe(201);
    const roomId = ((await made.json()) as { room: { id: string } }).room.id;
    await page.goto(`/jobs/${jobId}`);
    await expect(page.getByLabel('Room name').inputValue()).resolves.toBe(`Bedroom ${tag}`);
    // The parts that load a beat later (job details, the room's loads) are in before the signal goes:
    // without the service worker (blocked here) a chunk asked for offline would fail.
    await page.waitForLoadState('networkidle');

    // The phone loses signal and renames the room; the edit waits on the phone.
    await context.setOffline(true);
    await page.getByLabel('Room name').fill(`Den ${tag}`);
    await pill(page)
      .filter({ hasText: /Offline — 1 change waiting/ })
      .waitFor({ timeout: 20_000 });

    // Meanwhile the owner, at the office desk, renames it too.
    const desk = await e.newPage(DESKTOP);
    await signIn(desk.page, owner.email, owner.password);
    await desk.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const me = (await (await desk.page.request.get('/api/auth/me')).json()) as { user: { name: string } };
    const deskCsrf = ((await (await desk.page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const now = (await (await desk.page.request.get(`/api/jobs/${jobId}/rooms/${roomId}`)).json()) as {
      room: { version: number; input: Record<string, unknown> };
    };
    const renamed = await desk.page.request.patch(`/api/jobs/${jobId}/rooms/${roomId}`, {
      headers: { 'X-CSRF-Token': deskCsrf, 'If-Match': `"${now.room.version}"`, 'X-Gaugeline-Device': 'desk-e2e-0042' },
      data: { input: { ...now.room.input, name: `Study ${tag}` } },
    });
    expect(renamed.status()).toBe(200);
    await desk.context.close();

    // Signal again: the phone's rename meets the owner's, and the panel says where and when it was made.
    await context.setOffline(false);
    const panel = page.getByRole('region', { name: 'Resolve conflicting changes' });
    await panel.waitFor({ timeout: 30_000 });
    const said = (await panel.textContent()) ?? '';
    expect(said).toMatch(/Changed on another device at \d{1,2}:\d\d/);
    expect(said).toContain(`by ${me.user.name}.`);
    await expect(pill(page).filter({ hasText: 'Needs your choice' }).count()).resolves.toBe(1);
    await page.screenshot({ path: `${SHOTS}/conflict-375.png`, fullPage: true, timeout: SHOT_TIMEOUT });
    await expectNoSeriousViolations(page);
    await page.setViewportSize(DESKTOP);
    await page.screenshot({ path: `${SHOTS}/conflict-1440.png`, fullPage: true, timeout: SHOT_TIMEOUT });

    await panel.getByRole('button', { name: 'Keep all mine' }).click();
    await pill(page)
      .filter({ hasText: /^\s*Saved\s*$/ })
      .waitFor({ timeout: 20_000 });
    const after = (await (await page.request.get(`/api/jobs/${jobId}/rooms/${roomId}`)).json()) as {
      room: { input: { name: string } };
    };
    expect(after.room.input.name).toBe(`Den ${tag}`);
    await context.close();
  });

  it('the owner’s Users, E-mail and Outbox pages opened with no signal say so in words', async () => {
    if (!owner) throw new Error('no demo owner');
    // The service worker holds the app's code (as on a phone that opened Gaugeline before); no page's data is held.
    const { context, page } = await e.newPage(DESKTOP, { serviceWorkers: 'allow' });
    onTestFailed(async () => {
      await page.screenshot({ path: `${SHOTS}/offline-office-failed.png`, fullPage: true }).catch(() => undefined);
    });
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.evaluate(async () => navigator.serviceWorker.ready);
    await page.reload();
    await page.getByRole('link', { name: 'Users' }).first().waitFor();
    expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL ?? '')).toMatch(/\/sw\.js$/);
    await context.setOffline(true);
    // The start page read the e-mail list ("N e-mails have not gone out") and the shell the outbox (whether this
    // server has one), so those two show what the device held; Users holds nothing.
    for (const [link, shot, held] of [
      ['Users', 'users', false],
      ['E-mail', 'mail', true],
      ['Outbox', 'outbox', true],
    ] as const) {
      await page.getByRole('link', { name: link, exact: true }).first().click();
      if (held) {
        await page.getByText('No signal — showing what this phone last saw').waitFor({ timeout: 10_000 });
      } else {
        await page.getByRole('heading', { name: 'No signal' }).waitFor({ timeout: 10_000 });
        await expect(page.getByText(/nothing of this page is saved on this phone yet/).count()).resolves.toBe(1);
      }
      await expectNoSeriousViolations(page);
      await page.screenshot({ path: `${SHOTS}/offline-${shot}-1440.png`, fullPage: true, timeout: SHOT_TIMEOUT });
      await page.setViewportSize(PHONE);
      await page.screenshot({ path: `${SHOTS}/offline-${shot}-375.png`, fullPage: true, timeout: SHOT_TIMEOUT });
      await page.setViewportSize(DESKTOP);
      // Back to the start page for the next link.
      await page.getByRole('link', { name: 'Gaugeline, start page' }).click();
      await page.getByRole('link', { name: 'Users' }).first().waitFor();
    }
    await context.close();
  });
});
