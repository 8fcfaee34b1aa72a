import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { expectNoSeriousViolations } from './axe';
import { PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const account = (role: string) => {
  const a = demoAccounts.find((x) => x.role === role && x.company.startsWith('Quillbrook'));
  if (!a) throw new Error(`no demo ${role}`);
  return a;
};

/** The estimator assigns the newest job to the installer, through the API as the job details form does. */
async function assignJob(page: Page): Promise<string> {
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  const staff = (await (await page.request.get('/api/staff')).json()) as { staff: Array<{ id: string; role: string }> };
  const installer = staff.staff.find((s) => s.role === 'installer');
  const jobs = (await (await page.request.get('/api/jobs?page=1&pageSize=5')).json()) as {
    items: Array<{ id: string; version: number }>;
  };
  const job = jobs.items[0];
  if (!installer || !job) throw new Error('no installer or no job in the demo data');
  const res = await page.request.patch(`/api/jobs/${job.id}`, {
    headers: { 'X-CSRF-Token': csrf, 'If-Match': `"${job.version}"` },
    data: { assignedInstallerId: installer.id },
  });
  expect(res.status()).toBe(200);
  return job.id;
}

/** Every control on the page that would change something (the account page's password form aside). */
const editControls = (page: Page) =>
  page.locator('main').locator('input:not([type=search]), textarea, select:not(#jobs-status), button[type=submit]');

describe('an installer on a phone', () => {
  it('reaches every page the role has, each readable and accessible, and none offers an edit', async () => {
    const estimator = await e.newPage(PHONE);
    await signIn(estimator.page, account('estimator').email, account('estimator').password);
    await estimator.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const jobId = await assignJob(estimator.page);
    await estimator.context.close();

    const installer = account('installer');
    const { context, page } = await e.newPage(PHONE);
    await signIn(page, installer.email, installer.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));

    // Home: what the role can do today.
    await page.getByRole('heading', { name: /^Hello/ }).waitFor();
    await expect(page.getByText(/job packet|commissioning|proposal/i).count()).resolves.toBe(0);
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/installer-home-375.png`, fullPage: true });

    // Jobs: the assigned job, no "New job".
    await page.goto('/jobs');
    await page.locator(`a[href="/jobs/${jobId}"]`).first().waitFor();
    await expect(page.getByRole('link', { name: 'New job' }).count()).resolves.toBe(0);
    await expect(page.getByText(/Start one with/).count()).resolves.toBe(0);
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/installer-jobs-375.png`, fullPage: true });

    // The job: read only — no input, no delete, no save pill.
    await page.locator(`a[href="/jobs/${jobId}"]`).first().click();
    await page.waitForURL(new RegExp(`/jobs/${jobId}$`));
    await page.getByRole('heading', { level: 1 }).first().waitFor();
    await expect(editControls(page).count()).resolves.toBe(0);
    await expect(page.getByRole('button', { name: /Delete|Add room|Save/ }).count()).resolves.toBe(0);
    await expect(
      page
        .getByRole('status')
        .filter({ hasText: /Saved|Saving|Not saved/ })
        .count(),
    ).resolves.toBe(0);
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/installer-job-375.png`, fullPage: true });

    // The equipment catalog: read, never edit.
    await page.goto('/price-book');
    await page.getByRole('heading', { level: 1 }).first().waitFor();
    await page.waitForLoadState('networkidle');
    await expect(page.getByRole('button', { name: /Import|Save|Add/ }).count()).resolves.toBe(0);
    await expectNoSeriousViolations(page);
    await page.screenshot({ path: `${SHOTS}/installer-catalog-375.png`, fullPage: true });

    // Their own account (changing one's password is theirs to do).
    await page.goto('/account');
    await page.getByRole('heading', { level: 1 }).first().waitFor();
    await expectNoSeriousViolations(page);

    // An office page is not theirs: back home with a notice, not the page.
    await page.goto('/users');
    await page.waitForURL((u) => u.pathname === '/');
    await expectNoSeriousViolations(page);
    await context.close();
  });
});
