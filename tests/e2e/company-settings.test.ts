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

  it('the owner edits the loss reasons on a phone: rename, move, add, a refusal beside the reason, “Saved” that holds after a reload, and the job’s “Mark lost” offers the new words', async () => {
    const owner = account('owner');
    const { page } = await e.newPage(PHONE);
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const before = (await (await page.request.get('/api/company/loss-reasons')).json()) as {
      lossReasons: { reasons: string[]; version: number };
    };
    await page.goto('/settings');
    const form = page.getByRole('form', { name: 'Loss reasons' });
    await form.getByLabel('Reason 1', { exact: true }).waitFor();
    await form.scrollIntoViewIfNeeded();
    const values = () =>
      form.getByRole('textbox').evaluateAll((els) => els.map((el) => (el as HTMLInputElement).value));
    expect(await values()).toEqual(before.lossReasons.reasons);
    await expectNoSeriousViolations(page);

    // A second reason with the first one's words: refused beside it, nothing saved.
    await form.getByRole('button', { name: 'Add a reason' }).click();
    const added = form.getByLabel(`Reason ${before.lossReasons.reasons.length + 1}`, { exact: true });
    await expect.poll(() => added.evaluate((el) => el === document.activeElement)).toBe(true);
    await added.fill(` ${before.lossReasons.reasons[0]?.toUpperCase() ?? ''} `);
    await form.getByRole('button', { name: 'Save the list' }).click();
    await form.getByText(/is on the list twice\.$/).waitFor();
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/company-settings-loss-reasons-refused-375.png`, fullPage: true });

    await added.fill('Chose to wait a year');
    await form.getByLabel('Reason 1', { exact: true }).fill('Price above their budget');
    await form.getByRole('button', { name: `Move reason ${before.lossReasons.reasons.length + 1} up` }).click();
    await form.getByRole('button', { name: 'Save the list' }).click();
    await form.getByText('Saved. “Mark lost” offers this list, in this order, from now on.').waitFor();
    const expected = ['Price above their budget', ...before.lossReasons.reasons.slice(1)];
    expected.splice(expected.length - 1, 0, 'Chose to wait a year');
    const saved = (await (await page.request.get('/api/company/loss-reasons')).json()) as {
      lossReasons: { reasons: string[]; version: number };
    };
    expect(saved.lossReasons.reasons).toEqual(expected);
    await page.screenshot({ path: `${SHOTS}/company-settings-loss-reasons-375.png`, fullPage: true });

    await page.reload();
    await form.getByLabel('Reason 1', { exact: true }).waitFor();
    expect(await values()).toEqual(expected);

    // A job the owner marks lost is offered the new words (the job page's status moves).
    const jobs = (await (await page.request.get('/api/jobs?page=1&pageSize=50')).json()) as {
      items: { id: string; status: string }[];
    };
    const design = jobs.items.find((j) => j.status === 'design');
    if (!design) throw new Error('no Larkspur job in design');
    await page.goto(`/jobs/${design.id}`);
    await page.getByText('Job details').click();
    await page.getByRole('button', { name: 'Mark lost' }).click();
    const why = page.getByRole('group', { name: 'Why was the job lost?' });
    await why.waitFor();
    expect(await why.getByRole('radio').evaluateAll((els) => els.map((el) => (el as HTMLInputElement).value))).toEqual(
      expected,
    );
    await page.getByRole('button', { name: 'Keep the job open' }).click();

    // Put the demo company's list back for the other journeys (through the API, with the version read).
    const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
    const restored = await page.request.put('/api/company/loss-reasons', {
      headers: { 'X-CSRF-Token': csrf, 'If-Match': `"${saved.lossReasons.version}"` },
      data: { reasons: before.lossReasons.reasons },
    });
    expect(restored.status()).toBe(200);
  });

  it('at 1440 px the page reads in columns; an estimator gets no Settings', async () => {
    const owner = account('owner');
    const { page } = await e.newPage(DESKTOP);
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.getByRole('link', { name: 'Settings' }).click();
    await page.getByRole('form', { name: 'Design defaults' }).waitFor();
    await page.getByRole('form', { name: 'Loss reasons' }).getByLabel('Reason 1', { exact: true }).waitFor();
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
