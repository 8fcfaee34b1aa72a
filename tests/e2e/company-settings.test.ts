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

async function savedDefaults(page: Page): Promise<Record<string, unknown>> {
  const r = await page.request.get('/api/company/settings');
  return ((await r.json()) as { settings: { defaultDesignConditions: Record<string, unknown> } }).settings
    .defaultDesignConditions;
}

describe('company design defaults', () => {
  it('the owner sets latitude, sky and ground defaults on a phone: refused values say why beside the field, a save holds after a reload', async () => {
    const owner = account('owner');
    const { page } = await e.newPage(PHONE);
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.goto('/settings');
    await page.getByRole('heading', { name: 'Company settings' }).waitFor();
    const form = page.getByRole('form', { name: 'Design defaults' });
    // The demo company's saved latitude (fixtures/demo-jobs.ts)
    expect(await form.getByLabel('Latitude').inputValue()).toBe('38.5');
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/company-settings-375.png`, fullPage: true });

    await form.getByLabel('Latitude').fill('75');
    await form.getByLabel('Clear-sky beam optical depth τb').fill('0.42');
    await form.getByRole('button', { name: 'Save design defaults' }).click();
    await form.getByText('Latitude must be between 60° S and 70° N').waitFor();
    await form.getByText('Enter both optical depths (τb and τd) from the same climatic table, or neither').waitFor();
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/company-settings-refused-375.png`, fullPage: true });
    expect((await savedDefaults(page)).clearSkyTauB).toBeUndefined();

    await form.getByLabel('Latitude').fill('38.5');
    await form.getByLabel('Clear-sky diffuse optical depth τd').fill('2.25');
    await form.getByLabel('Source of τb and τd').fill('Invented station table, July');
    await form.getByLabel('Design ground temperature (basements)').fill('48');
    await form.getByRole('button', { name: 'Save design defaults' }).click();
    await form.getByText('Saved. New jobs start from these values.').waitFor();
    expect(await savedDefaults(page)).toMatchObject({
      latitudeDeg: 38.5,
      clearSkyTauB: 0.42,
      clearSkyTauD: 2.25,
      groundDesignF: 48,
    });

    await page.reload();
    await form.getByLabel('Design ground temperature (basements)').waitFor();
    expect(await form.getByLabel('Design ground temperature (basements)').inputValue()).toBe('48');
    expect(await form.getByLabel('Clear-sky diffuse optical depth τd').inputValue()).toBe('2.25');

    // Put the demo company's defaults back as they were for the other journeys.
    for (const label of [
      'Clear-sky beam optical depth τb',
      'Clear-sky diffuse optical depth τd',
      'Source of τb and τd',
      'Design ground temperature (basements)',
    ])
      await form.getByLabel(label).fill('');
    await form.getByRole('button', { name: 'Save design defaults' }).click();
    await form.getByText('Saved. New jobs start from these values.').waitFor();
    const restored = await savedDefaults(page);
    expect(restored.groundDesignF).toBeUndefined();
    expect(restored.clearSkyTauB).toBeUndefined();
  });

  it('at 1440 px the page reads in columns; an estimator gets no Settings', async () => {
    const owner = account('owner');
    const { page } = await e.newPage(DESKTOP);
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('form', { name: 'Design defaults' }).waitFor();
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/company-settings-1440.png`, fullPage: true });

    const estimator = account('estimator');
    const other = await e.newPage(DESKTOP);
    await signIn(other.page, estimator.email, estimator.password);
    await other.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    expect(await other.page.getByRole('link', { name: 'Settings' }).count()).toBe(0);
    await other.page.goto('/settings');
    await other.page.waitForURL((u) => u.pathname === '/');
  });
});
