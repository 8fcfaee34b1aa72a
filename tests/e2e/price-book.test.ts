import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { expectNoSeriousViolations } from './axe';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const account = (role: string) => {
  const a = demoAccounts.find((x) => x.role === role && x.company.startsWith('Larkspur'));
  if (!a) throw new Error(`no demo ${role}`);
  return a;
};

async function materialCost(page: Page, sku: string): Promise<number> {
  const r = await page.request.get(`/api/company-data/materials/${sku}`);
  return ((await r.json()) as { row: { record: { costCents: number } } }).row.record.costCents;
}

const chooseFile = (page: Page, rows: string[][]) =>
  page.getByLabel('Choose a CSV file').setInputFiles({
    name: 'materials.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from(stringify(rows)),
  });

describe('price book and catalog', () => {
  it('the owner imports the price book with two new prices: a bad row stops it, the fixed file goes in with its history', async () => {
    const owner = account('owner');
    const { context, page } = await e.newPage(DESKTOP);
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.goto('/price-book?table=materials');
    await page.getByRole('heading', { name: 'Price book & catalog' }).waitFor();

    const exported = await (await page.request.get('/api/company-data/materials/csv/export')).text();
    const rows: string[][] = parse(exported, { bom: true });
    const cost = (rows[0] ?? []).indexOf('cost_usd');
    const before = { cu: await materialCost(page, 'CU-38'), ws: await materialCost(page, 'WS-3') };
    const newPrice = (sku: string, v: string) =>
      rows.map((r) => (r[0] === sku ? r.map((c, i) => (i === cost ? v : c)) : r));
    const twoNew = newPrice('WS-3', '8.45').map((r) =>
      r[0] === 'CU-38' ? r.map((c, i) => (i === cost ? '1.52' : c)) : r,
    );
    const withBad = twoNew.map((r) => (r[0] === 'TAPE-UV' ? r.map((c, i) => (i === cost ? 'six fifty' : c)) : r));

    await page.getByRole('button', { name: 'Import CSV' }).click();
    await chooseFile(page, withBad);
    await page.getByText('cost_usd: "six fifty" is not an amount in dollars').waitFor();
    expect(await page.getByRole('button', { name: 'Confirm import' }).isDisabled()).toBe(true);
    await page.screenshot({ path: `${SHOTS}/price-book-import-refused-1440.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    expect(await materialCost(page, 'CU-38')).toBe(before.cu);

    await chooseFile(page, twoNew);
    const preview = page.getByRole('table', { name: 'Rows in the file' });
    await preview.getByRole('cell', { name: 'CU-38', exact: true }).waitFor();
    expect(await preview.getByRole('row').count()).toBe(3); // header + two changed rows
    await page.screenshot({ path: `${SHOTS}/price-book-import-preview-1440.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    await page.getByRole('button', { name: 'Confirm import' }).click();
    await page.getByText('Imported materials.csv: 0 new, 2 changed.').waitFor();
    expect(await materialCost(page, 'CU-38')).toBe(152);
    expect(await materialCost(page, 'WS-3')).toBe(845);

    await page.getByRole('button', { name: 'Close' }).click();
    await page.getByLabel('Search materials').fill('CU-38');
    await page.getByRole('table', { name: 'Materials' }).getByRole('button', { name: 'CU-38' }).click();
    const history = page.getByRole('region', { name: 'Price history' });
    await history.getByText('imported').first().waitFor();
    await history.getByText('1.52').first().waitFor();
    await page.screenshot({ path: `${SHOTS}/price-book-history-1440.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    await context.close();
  });

  it('a salesperson on a phone finds a multi-zone unit and sees its capacity, never its cost', async () => {
    const sales = account('salesperson');
    const { context, page } = await e.newPage(PHONE);
    await signIn(page, sales.email, sales.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.goto('/price-book');
    await page.getByRole('heading', { name: 'Equipment catalog' }).waitFor();
    await page.getByLabel('Kind').selectOption('outdoor-multi-zone');
    await page.getByLabel('Search equipment catalog').fill('36k');
    await page.getByRole('list', { name: 'Equipment catalog' }).getByRole('button').first().click();
    await page.getByText('Rated capacity, Btu/h, by outdoor °F').waitFor();
    const panel = page.getByRole('complementary');
    await panel.getByText('List $', { exact: true }).waitFor();
    expect(await panel.getByText('Cost $', { exact: true }).count()).toBe(0);
    expect(await page.getByRole('button', { name: 'Save changes' }).count()).toBe(0);
    await page.screenshot({ path: `${SHOTS}/price-book-catalog-375.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    const width = await page.evaluate(() => document.documentElement.scrollWidth);
    expect(width).toBeLessThanOrEqual(375);
    await context.close();
  });
});
