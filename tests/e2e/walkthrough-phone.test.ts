import { randomUUID } from 'node:crypto';
import type { Locator, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { expectNoSeriousViolations } from './axe';
import { sampleRoom } from '../server/jobs-helpers';
import { PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

/**
 * Issue 10, "fits one hand": a typical bedroom entered on a 375 px phone whose CPU runs 4× slower
 * (Chromium's DevTools Emulation.setCPUThrottlingRate), counting every tap and every field, and the
 * save status checked against the server. No timing is asserted: a slow phone may be slow, never wrong.
 */
let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const salesperson = demoAccounts.find((a) => a.role === 'salesperson' && a.company.startsWith('Quillbrook'));
const pill = (page: Page) =>
  page.getByRole('status').filter({ hasText: /Saved|Saving|Offline|Not saved|Needs your choice/ });

/**
 * What the person does, counted: a tap is one touch (a button, a folded line, a field to type in; a
 * list costs two, open and choose); a field is one value typed or chosen.
 */
class Hand {
  taps = 0;
  fields = 0;
  async tap(target: Locator): Promise<void> {
    this.taps += 1;
    await target.click();
  }
  async type(field: Locator, value: string): Promise<void> {
    this.taps += 1;
    this.fields += 1;
    await field.click();
    await field.fill(value);
  }
  async choose(list: Locator, label: string): Promise<void> {
    this.taps += 2;
    this.fields += 1;
    await list.selectOption({ label });
  }
}

interface SavedRoom {
  version: number;
  input: {
    name: string;
    lengthFt: number;
    widthFt: number;
    exposedWalls: Array<{ direction: string; lengthFt: number; windows: Array<{ widthIn: number; heightIn: number }> }>;
  };
}

describe('a bedroom on a slow phone', () => {
  it('a 12 × 11 ft bedroom with two outside walls and one window: counted taps and fields, and “Saved” means saved', async () => {
    if (!salesperson) throw new Error('no demo salesperson');
    const { context, page } = await e.newPage(PHONE);
    onTestFailed(async () => {
      await page.screenshot({ path: `${SHOTS}/bedroom-slow-failed-375.png`, fullPage: true }).catch(() => undefined);
    });
    await signIn(page, salesperson.email, salesperson.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const tag = randomUUID().slice(0, 6);
    const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const customer = await page.request.post('/api/customers', {
      headers: { 'X-CSRF-Token': csrf },
      data: { name: `Tamsin Slowphone-${tag}`, email: `tamsin-${tag}@example.com` },
    });
    const customerId = ((await customer.json()) as { customer: { id: string } }).customer.id;
    const job = await page.request.post('/api/jobs', {
      headers: { 'X-CSRF-Token': csrf },
      data: { customerId, street: '4 Ember Row', city: 'Testerby', region: 'Demo State', postalCode: '00004' },
    });
    const jobId = ((await job.json()) as { job: { id: string } }).job.id;

    // A phone four times slower than this machine, from here on.
    const cdp = await context.newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: 4 });
    await page.goto(`/jobs/${jobId}`);
    await page.getByRole('button', { name: 'Add room' }).waitFor({ timeout: 30_000 });

    // The count starts on the job's walk-through.
    const hand = new Hand();
    const template = page.getByLabel('Room template');
    if ((await template.inputValue()) !== 'bedroom') await hand.choose(template, 'Bedroom');
    await hand.tap(page.getByRole('button', { name: 'Add room' }));
    await hand.type(page.getByLabel('Room name'), `Bedroom ${tag}`);
    await hand.type(page.getByLabel('Length', { exact: true }), '12');
    await hand.type(page.getByLabel('Width', { exact: true }), '11');
    // Wall 1 came with the template (folded): it faces east here, with the window, measured 30 × 48 in.
    await hand.tap(page.locator('summary', { hasText: /^Wall 1:/ }));
    await hand.choose(page.getByLabel('Wall faces').first(), 'E');
    await hand.tap(page.locator('summary', { hasText: /^Window 1:/ }));
    await hand.type(page.getByLabel('Window width').first(), '30');
    await hand.type(page.getByLabel('Window height').first(), '48');
    // Wall 2, north (the new wall's default), 11 ft, no window.
    await hand.tap(page.getByRole('button', { name: 'Add wall' }));
    await hand.type(page.getByLabel('Wall length').last(), '11');

    // The status is true: while anything is on its way it does not say "Saved"; once it does, the server has it all.
    const saved = pill(page).filter({ hasText: /^\s*Saved\s*$/ });
    await saved.waitFor({ timeout: 60_000 });
    const rooms = (await (await page.request.get(`/api/jobs/${jobId}/rooms`)).json()) as { rooms: SavedRoom[] };
    const room = rooms.rooms.find((r) => r.input.name === `Bedroom ${tag}`);
    expect(room?.input).toMatchObject({
      lengthFt: 12,
      widthFt: 11,
      exposedWalls: [
        { direction: 'E', lengthFt: 12, windows: [{ widthIn: 30, heightIn: 48 }] },
        { direction: 'N', lengthFt: 11, windows: [] },
      ],
    });
    expect(room?.input.exposedWalls).toHaveLength(2);
    await expect(pill(page).textContent()).resolves.toMatch(/^\s*Saved\s*$/);

    await page.screenshot({ path: `${SHOTS}/bedroom-slow-375.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    // The figures for the note (before: 24 taps, 15 fields); the bound keeps them from creeping back.
    console.log(`a 12 × 11 ft bedroom, two outside walls, one window: ${hand.taps} taps, ${hand.fields} fields`);
    expect(hand.taps).toBeLessThan(24);
    expect(hand.fields).toBeLessThan(15);
    await context.close();
  });

  it('typing 1000 into Length (limit 200 ft) never stores 100, the prefix typed on the way: checked on the server', async () => {
    if (!salesperson) throw new Error('no demo salesperson');
    const { context, page } = await e.newPage(PHONE);
    await signIn(page, salesperson.email, salesperson.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const tag = randomUUID().slice(0, 6);
    const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const headers = { 'X-CSRF-Token': csrf };
    const customer = await page.request.post('/api/customers', {
      headers,
      data: { name: `Ansel Typethrough-${tag}`, email: `ansel-${tag}@example.com` },
    });
    const customerId = ((await customer.json()) as { customer: { id: string } }).customer.id;
    const job = await page.request.post('/api/jobs', {
      headers,
      data: { customerId, street: '6 Ember Row', city: 'Testerby', region: 'Demo State', postalCode: '00006' },
    });
    const jobId = ((await job.json()) as { job: { id: string } }).job.id;
    const made = await page.request.post(`/api/jobs/${jobId}/rooms`, { headers, data: { input: sampleRoom('Den') } });
    const roomId = ((await made.json()) as { room: { id: string } }).room.id;
    const server = async () =>
      ((await (await page.request.get(`/api/jobs/${jobId}/rooms/${roomId}`)).json()) as { room: SavedRoom }).room;

    await page.goto(`/jobs/${jobId}`);
    const length = page.getByLabel('Length', { exact: true });
    await length.waitFor();
    await pill(page)
      .filter({ hasText: /^\s*Saved\s*$/ })
      .waitFor();
    // The page's clock stands still while the keys go in, so however slow this machine is, no pause
    // happens between "100" and "1000" (a real pause there would rightly save 100).
    await page.clock.install();
    await length.fill('');
    await length.pressSequentially('1000');
    await page.getByText('Length must be between 1 and 200 ft').waitFor();
    // Then well past the autosave pause.
    await page.clock.runFor(5000);
    await pill(page).filter({ hasText: 'Not saved — 1 field to fix' }).waitFor();
    const before = await server();
    expect(before.input.lengthFt).toBe(16);
    expect(before.version).toBe(1);

    // Fixed: saved, and the server has it.
    await length.fill('14');
    await page.clock.runFor(5000);
    await pill(page)
      .filter({ hasText: /^\s*Saved\s*$/ })
      .waitFor({ timeout: 20_000 });
    expect((await server()).input.lengthFt).toBe(14);
    await context.close();
  });
});
