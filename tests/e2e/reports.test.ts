import { readFileSync } from 'node:fs';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { DESIGN, SITE } from '../helpers/sample-job';
import { expectNoSeriousViolations } from './axe';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';
import { api, until } from './proposal-helpers';

/**
 * Issue 15 (reports15): the owner opens the reports and sees a job counted — one made, issued and marked lost
 * through the API just before, in today's range — downloads the CSV with the same figures, and the page reads
 * at 1440 px and 375 px (no sideways scroll) with axe on each. Other e2e files may issue proposals today on the
 * same database, so the counts are checked as "at least", and the lost reason this test gave is looked for.
 */
let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const owner = demoAccounts.find((a) => a.role === 'owner' && a.company.startsWith('Larkspur'));
const REASON = 'Repaired the old system instead';

/** A job of the owner's company with one room and a 12k single-zone option, marked ready, issued and lost. */
async function lostJob(page: Page): Promise<string> {
  const customer = await api(page, 'post', '/api/customers', {
    name: 'Wendeline Corrabeck',
    email: `wendeline-${Date.now()}@example.com`,
  });
  const customerId = (customer.customer as { id: string }).id;
  const job = (await api(page, 'post', '/api/jobs', { customerId, ...SITE, designConditions: DESIGN })).job as {
    id: string;
  };
  const room = (
    await api(page, 'post', `/api/jobs/${job.id}/rooms`, {
      input: {
        name: 'Sunroom',
        lengthFt: 16,
        widthFt: 12,
        ceilingHeightFt: 8,
        exposedWalls: [{ direction: 'S', lengthFt: 16, windows: [{ widthIn: 36, heightIn: 48, count: 2 }] }],
        above: { kind: 'attic', insulation: 'r38' },
        below: { kind: 'crawlspace', vented: true, insulation: 'r19' },
        occupants: 2,
      },
    })
  ).room as { id: string };
  await api(page, 'post', `/api/jobs/${job.id}/options`, {
    name: 'Sunroom comfort',
    design: {
      zones: [{ key: 'z1', name: 'Sunroom', roomIds: [room.id], indoorUnitKey: 'TSL-S12H-W' }],
      systems: [
        {
          key: 's1',
          name: 'Sunroom system',
          outdoorUnitKey: 'TSL-S12H-O',
          circuits: [{ zoneKey: 'z1', lengthFt: 25 }],
          electrical: { circuitLengthFt: 40 },
        },
      ],
    },
  });
  await api(page, 'post', `/api/jobs/${job.id}/ready`, {
    sizingOverride: { reason: 'The owners want the sunroom usable all year.' },
  });
  await api(page, 'post', `/api/jobs/${job.id}/proposal/versions`);
  const now = (await api(page, 'get', `/api/jobs/${job.id}`)).job as { version: number };
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const lost = await page.request.patch(`/api/jobs/${job.id}`, {
    headers: { 'X-CSRF-Token': csrf, 'If-Match': `"${now.version}"` },
    data: { status: 'lost', lostReason: REASON },
  });
  expect(lost.status(), await lost.text()).toBe(200);
  return job.id;
}

const noSidewaysScroll = (page: Page) =>
  page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth + 1);

describe('the owner’s reports', () => {
  it('count a job lost today, filter by salesperson in the URL, download the CSV; readable at 1440 and 375 px', async () => {
    if (!owner) throw new Error('no Larkspur owner');
    const { context, page } = await e.newPage(DESKTOP);
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await lostJob(page);

    const today = new Date().toISOString().slice(0, 10);
    await page.goto(`/reports?from=${today}&to=${today}`);
    await page.getByRole('heading', { name: 'Reports', level: 1 }).waitFor();
    const lostTable = page.getByRole('table', { name: /Lost reasons/ });
    const reasonRow = lostTable.getByRole('row', { name: new RegExp(REASON) });
    await reasonRow.waitFor();
    expect(Number(await reasonRow.getByRole('cell').last().textContent())).toBeGreaterThanOrEqual(1);
    // The totals: at least this proposal, decided and lost.
    const proposals = page.locator('dt', { hasText: /^Proposals$/ }).locator('xpath=following-sibling::dd[1]');
    expect(Number(await proposals.textContent())).toBeGreaterThanOrEqual(1);
    await expect(page.getByLabel('Issued from').inputValue()).resolves.toBe(today);
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/reports-today-1440.png`, fullPage: true });

    // The whole history (no filter): the demo's 18 months, by month.
    await page.getByRole('button', { name: 'Clear filters' }).click();
    await page.waitForURL((u) => u.search === '');
    await page
      .getByRole('table', { name: /Win rate by month/ })
      .getByRole('row')
      .nth(10)
      .waitFor();
    await page.screenshot({ path: `${SHOTS}/reports-history-1440.png`, fullPage: true });

    // One salesperson: the choice goes into the URL, and the page shows that person's figures.
    const chosen = await page
      .getByLabel('Salesperson', { exact: true })
      .locator('option')
      .nth(1)
      .evaluate((o) => (o as HTMLOptionElement).value);
    await page.getByLabel('Salesperson', { exact: true }).selectOption(chosen);
    await page.waitForURL((u) => u.searchParams.get('salesperson') === chosen);
    // The figures before the choice stay on screen until the new ones come: wait for the table of one person.
    const people = page.getByRole('table', { name: /Win rate by salesperson/ }).getByRole('row');
    await until('one salesperson’s table', async () => ((await people.count()) === 2 ? true : undefined));
    await page.locator('[data-testid="reports-results"][aria-busy="false"]').waitFor();

    // The CSV of the same filters.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByRole('link', { name: 'Download CSV' }).click(),
    ]);
    const csv = readFileSync((await download.path()) ?? '', 'utf8');
    expect(download.suggestedFilename()).toBe('sales-report.csv');
    expect(csv).toMatch(/^\uFEFFSection,Group,Proposals,Won,Lost,Decided,Win rate %,Revenue \$\r\n/);
    expect(csv).toContain('By salesperson,');
    expect(csv.split('\r\n').filter((l) => l.startsWith('By salesperson,'))).toHaveLength(1);
    await context.close();

    // A phone: the same page reads without sideways scrolling.
    const phone = await e.newPage(PHONE);
    await signIn(phone.page, owner.email, owner.password);
    await phone.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await phone.page.goto('/reports');
    await phone.page.getByRole('table', { name: /Win rate by sizing/ }).waitFor();
    await expect(noSidewaysScroll(phone.page)).resolves.toBe(true);
    await expectNoSeriousViolations(phone.page);
    await phone.page.screenshot({ path: `${SHOTS}/reports-375.png`, fullPage: true });
    await phone.context.close();
  });
});
