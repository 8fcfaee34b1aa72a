import { randomUUID } from 'node:crypto';
import sharp from 'sharp';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFailed } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { expectNoSeriousViolations } from './axe';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const salesperson = demoAccounts.find((a) => a.role === 'salesperson' && a.company.startsWith('Quillbrook'));

const pill = (page: Page) =>
  page.getByRole('status').filter({ hasText: /Saved|Saving|Offline|Not saved|Needs your choice/ });
/** "Saved" and still "Saved" a moment later: past the autosave debounce, nothing waiting. */
async function waitSaved(page: Page): Promise<void> {
  const saved = pill(page).filter({ hasText: /^\s*Saved\s*$/ });
  for (let stable = 0; stable < 2;) {
    await saved.waitFor({ timeout: 20_000 });
    await page.waitForTimeout(700);
    stable = (await saved.count()) > 0 ? stable + 1 : 0;
  }
}

async function addRoom(page: Page, template: string): Promise<void> {
  await page.getByLabel('Room template').selectOption({ label: template });
  await page.getByRole('button', { name: 'Add room' }).click();
}

async function fillNumber(page: Page, label: string, value: string): Promise<void> {
  const input = page.getByLabel(label, { exact: true }).first();
  await input.fill(value);
}

describe('a salesperson walks a home on a phone', () => {
  // Rooms, windows, a copied room, photos (one taken offline), live loads, a cut network, a reload.
  it('creates a job, enters rooms with windows, adds a photo, sees live loads, and loses nothing offline', async () => {
    if (!salesperson) throw new Error('no demo salesperson');
    const { context, page } = await e.newPage(PHONE);
    // Room writes and browser errors, printed only if the journey fails, to tell what went out.
    const t0 = Date.now();
    const trail: string[] = [];
    const note = (line: string) => trail.push(`${String(Date.now() - t0).padStart(6)} ms ${line}`);
    page.on('request', (r) => {
      if (r.url().includes('/rooms') && r.method() !== 'GET')
        note(
          `→ ${r.method()} …${r.url().slice(-14)} ${(r.postData() ?? '').match(/"name":"[^"]*"/)?.[0] ?? ''} If-Match ${r.headers()['if-match'] ?? '-'}`,
        );
    });
    page.on('response', (r) => {
      if (r.url().includes('/rooms')) note(`← ${r.status()} ${r.request().method()} …${r.url().slice(-14)}`);
    });
    page.on('console', (m) => note(`console.${m.type()}: ${m.text()}`));
    onTestFailed(() => console.log(`room writes during the journey:\n${trail.join('\n')}`));
    await signIn(page, salesperson.email, salesperson.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));

    // Customer and job
    const tag = randomUUID().slice(0, 6);
    await page.goto('/jobs');
    await page.getByRole('heading', { name: 'Jobs' }).waitFor();
    await expectNoSeriousViolations(page);
    await page
      .getByRole('link', { name: 'New job' })
      .or(page.getByRole('button', { name: 'New job' }))
      .first()
      .click();
    await page.getByLabel('Customer name').fill(`Wren Example-${tag}`);
    await page.getByLabel('Customer e-mail').fill(`wren-${tag}@example.com`);
    await page.getByLabel('Customer phone').fill('555-0142');
    await page.getByLabel('Street address').fill('3 Example Row');
    await page.getByLabel('City or town').fill('Testerby');
    await page.getByLabel('State or region').fill('Demo State');
    await page.getByLabel('Postal code').fill('00001');
    await page.screenshot({ path: `${SHOTS}/new-job-375.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    await page.getByRole('button', { name: 'Create job and start the walk-through' }).click();
    await page.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
    const jobId = new URL(page.url()).pathname.split('/').pop() ?? '';

    // Room 1: a living room from its template, with a longer south wall
    await addRoom(page, 'Living room');
    await page.getByLabel('Room name').fill('Front room');
    await fillNumber(page, 'Length', '20');
    await waitSaved(page);
    const loadsPanel = page
      .getByText('This room’s loads')
      .locator('xpath=ancestor::section[1]')
      .or(page.locator('section', { hasText: 'This room’s loads' }))
      .first();
    await loadsPanel.waitFor();
    const before = await page.locator('section', { hasText: 'This room’s loads' }).last().innerText();
    await fillNumber(page, 'Length', '24');
    // live: the browser's numbers change before anything is saved
    await expect
      .poll(async () => page.locator('section', { hasText: 'This room’s loads' }).last().innerText(), { timeout: 5000 })
      .not.toBe(before);
    await waitSaved(page);

    // Room 2: a bedroom with one more window on its wall
    await addRoom(page, 'Bedroom');
    note(`added bedroom; editor shows ${await page.getByLabel('Room name').inputValue()}`);
    await page.getByLabel('Room name').fill('Bedroom east');
    // The template's wall is complete, so it is folded to one line: a tap opens it.
    await page.locator('summary', { hasText: /^Wall 1:/ }).click();
    await page.getByRole('button', { name: 'Add window' }).first().click();
    await page.getByLabel('Window width').last().fill('30');
    await page.getByLabel('Window height').last().fill('48');
    await waitSaved(page);

    // Room 3: a copy of the previous room, renamed
    await page.getByRole('button', { name: 'Copy room' }).click();
    note(`copied; editor shows ${await page.getByLabel('Room name').inputValue()}`);
    await page.getByLabel('Room name').fill('Bedroom west');
    await waitSaved(page);

    // A photo for room 3, a real JPEG made here
    const jpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: { r: 120, g: 160, b: 180 } } })
      .jpeg()
      .toBuffer();
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: 'bedroom-west.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    await page.getByRole('img', { name: /Photo 1 of 1/ }).waitFor({ timeout: 15_000 });
    await page.screenshot({ path: `${SHOTS}/walkthrough-375.png`, fullPage: true });
    await expectNoSeriousViolations(page);

    // Room 4 is edited with the network cut, then the network comes back
    await addRoom(page, 'Kitchen');
    await waitSaved(page);
    await context.setOffline(true);
    await page.getByLabel('Room name').fill('Kitchen while offline');
    await fillNumber(page, 'Length', '16');
    // a photo taken with no signal waits on the phone
    await page
      .locator('input[type="file"]')
      .setInputFiles({ name: 'kitchen-offline.jpg', mimeType: 'image/jpeg', buffer: jpeg });
    await page.getByText('waiting to upload').first().waitFor();
    await pill(page)
      .filter({ hasText: /Offline — \d+ changes? waiting/ })
      .waitFor({ timeout: 20_000 });
    await page.screenshot({ path: `${SHOTS}/walkthrough-offline-375.png` });
    await context.setOffline(false);
    await waitSaved(page);

    // After a reload every value is there, from the server
    await page.reload();
    await waitSaved(page);
    const rooms = await page.request.get(`/api/jobs/${jobId}/rooms`);
    expect(rooms.status()).toBe(200);
    const body = (await rooms.json()) as {
      rooms: Array<{
        input: { name: string; lengthFt?: number; exposedWalls: Array<{ windows: unknown[] }> };
        photos: unknown[];
      }>;
    };
    const byName = new Map(body.rooms.map((r) => [r.input.name, r]));
    expect([...byName.keys()].sort()).toEqual(['Bedroom east', 'Bedroom west', 'Front room', 'Kitchen while offline']);
    expect(byName.get('Front room')?.input.lengthFt).toBe(24);
    expect(byName.get('Kitchen while offline')?.input.lengthFt).toBe(16);
    expect(byName.get('Bedroom east')?.input.exposedWalls[0]?.windows.length).toBe(2);
    expect(byName.get('Bedroom west')?.input.exposedWalls[0]?.windows.length).toBe(2);
    expect(byName.get('Bedroom west')?.photos.length).toBe(1);
    expect(byName.get('Kitchen while offline')?.photos.length).toBe(1);
    await page.getByRole('button', { name: /Kitchen while offline/ }).click();
    await expect(page.getByLabel('Room name').inputValue()).resolves.toBe('Kitchen while offline');

    // The loads screen shows the server's own recalculation of the whole-home block load
    const serverLoads = (await (await page.request.get(`/api/jobs/${jobId}/loads`)).json()) as {
      loads: { totals: { coolingBtuh: number } };
    };
    await page.goto(`/jobs/${jobId}/loads`);
    await page
      .getByRole('region', { name: 'Whole-home loads' })
      .getByText(`${serverLoads.loads.totals.coolingBtuh.toLocaleString('en-US')} Btu/h`, { exact: false })
      .first()
      .waitFor({ timeout: 15_000 });
    await page.screenshot({ path: `${SHOTS}/loads-375.png`, fullPage: true });
    // Each room's drill-down opens to its parts at its peak hour, walls and windows by façade
    const drill = page.getByText(/^What makes up the peak/).first();
    await drill.click();
    await page
      .getByRole('row', { name: /^facing/ })
      .first()
      .waitFor();
    await drill.scrollIntoViewIfNeeded();
    await page.screenshot({ path: `${SHOTS}/loads-drilldown-375.png` });
    await expectNoSeriousViolations(page);
    await page.goto(`/jobs/${jobId}/loads/print`);
    await page.getByText('Heating and cooling load summary').waitFor();
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/print-375.png`, fullPage: true });
    await context.close();

    const desk = await e.newPage(DESKTOP);
    await signIn(desk.page, salesperson.email, salesperson.password);
    await desk.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    for (const [path, name] of [
      [`/jobs/${jobId}`, 'walkthrough'],
      [`/jobs/${jobId}/loads`, 'loads'],
      ['/jobs', 'jobs'],
    ] as const) {
      await desk.page.goto(path);
      await desk.page.waitForLoadState('networkidle');
      await desk.page.screenshot({ path: `${SHOTS}/${name}-1440.png`, fullPage: true });
      await expectNoSeriousViolations(desk.page);
    }
    await desk.context.close();
  });
});
