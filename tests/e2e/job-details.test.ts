import { randomUUID } from 'node:crypto';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { checkedPages, expectNoSeriousViolations } from './axe';
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

async function newJob(page: Page, customer: string): Promise<string> {
  await page.goto('/jobs/new');
  await page.getByLabel('Customer name').fill(customer);
  await page.getByLabel('Street address').fill('9 Example Court');
  await page.getByLabel('City or town').fill('Testerby');
  await page.getByLabel('State or region').fill('Demo State');
  await page.getByLabel('Postal code').fill('00009');
  await expectNoSeriousViolations(page);
  await page.getByRole('button', { name: 'Create job and start the walk-through' }).click();
  await page.waitForURL(/\/jobs\/[0-9a-f-]{36}$/);
  return new URL(page.url()).pathname.split('/').pop() ?? '';
}

describe('the job itself, from the walk-through', () => {
  it('a salesperson on a phone corrects the customer’s phone, moves the job to design, and deletes a job made by mistake', async () => {
    const sales = account('salesperson');
    const { context, page } = await e.newPage(PHONE);
    await signIn(page, sales.email, sales.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.getByTestId('user-name').first().waitFor();
    await expectNoSeriousViolations(page);
    const tag = randomUUID().slice(0, 6);
    const jobId = await newJob(page, `Juniper Example-${tag}`);

    await page.getByText('Job details').click();
    await page.getByLabel('Customer phone').fill('555-0177');
    await page.getByRole('button', { name: 'Save details' }).click();
    await page.getByText('Details saved.').waitFor();
    await expectNoSeriousViolations(page);
    await page.getByRole('button', { name: 'Move to design' }).click();
    await page.getByRole('button', { name: 'Back to walk-through' }).waitFor();
    await page.screenshot({ path: `${SHOTS}/job-details-375.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    const saved = await page.request.get(`/api/jobs/${jobId}`);
    expect(((await saved.json()) as { job: { status: string } }).job.status).toBe('design');

    page.once('dialog', (d) => void d.accept());
    await page.getByRole('button', { name: 'Delete job' }).click();
    await page.waitForURL((u) => u.pathname === '/jobs');
    await page.getByLabel('Search jobs').fill(tag);
    await page.getByText('No job matches').waitFor();
    await expectNoSeriousViolations(page);
    expect((await page.request.get(`/api/jobs/${jobId}`)).status()).toBe(404);
    await context.close();
  });

  it('an owner at a desk hands a job to an installer', async () => {
    const owner = account('owner');
    const { context, page } = await e.newPage(DESKTOP);
    await signIn(page, owner.email, owner.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const jobId = await newJob(page, `Sorrel Example-${randomUUID().slice(0, 6)}`);
    await page.getByText('Job details').click();
    const installer = page.getByLabel('Installer');
    const choice = (await installer.locator('option').allTextContents()).find((t) => t !== 'Not assigned yet');
    if (!choice) throw new Error('no installer offered');
    await installer.selectOption({ label: choice });
    await page.getByRole('button', { name: 'Save details' }).click();
    await page.getByText('Details saved.').waitFor();
    await page.screenshot({ path: `${SHOTS}/job-details-1440.png`, fullPage: true });
    await expectNoSeriousViolations(page);
    const saved = (await (await page.request.get(`/api/jobs/${jobId}`)).json()) as {
      job: { assignedInstaller: { name: string } | null };
    };
    expect(saved.job.assignedInstaller?.name).toBe(choice);
    // Every page both journeys visited had the accessibility check (serious or critical findings fail).
    for (const path of ['/', '/jobs/new', '/jobs/:id', '/jobs']) expect([...checkedPages], path).toContain(path);
    await context.close();
  });
});
