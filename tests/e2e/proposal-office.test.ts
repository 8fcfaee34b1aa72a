import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts } from '../../fixtures/seed';
import { axeViolations } from './axe';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

/**
 * Issue 14 (office14): the estimator issues a proposal from the desk's ready job, watches its PDF go from
 * waiting to the preview, changes an option, issues the next version and reads what changed. Quillbrook's
 * ready demo job (Larkspur's carries the demo proposal and the desk journey); on a database an earlier run
 * used, the job already has versions and the journey issues the next ones.
 */
let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const estimator = demoAccounts.find((x) => x.role === 'estimator' && x.company.startsWith('Quillbrook'));

async function api(page: Page) {
  const csrf = ((await (await page.request.get('/api/auth/csrf')).json()) as { token: string }).token;
  return { 'X-CSRF-Token': csrf };
}

/**
 * The Quillbrook job the seed marked ready to propose. Other files mark Quillbrook jobs ready too on the same
 * database (desk-ready's, with units outside their range and a reason), so the one taken is a ready job whose
 * readiness needed no sizing reason: this journey re-marks it ready without one.
 */
async function readyJob(page: Page): Promise<string> {
  const list = (await (await page.request.get('/api/jobs?page=1&pageSize=50')).json()) as {
    items: { id: string; status: string; readyToProposeAt: string | null; hasProposal: boolean }[];
  };
  // In design: the demo's proposals in every state (fixtures/demo-proposal-states.ts) were marked ready too, and
  // have since been sent, signed or lost.
  for (const job of list.items.filter((j) => j.readyToProposeAt !== null && j.status === 'design')) {
    const desk = (await (await page.request.get(`/api/jobs/${job.id}/desk`)).json()) as {
      readiness: { ready: boolean; sizingOverride: unknown };
    };
    if (desk.readiness.ready && desk.readiness.sizingOverride === null) return job.id;
  }
  throw new Error('no Quillbrook job marked ready without a sizing reason');
}

/** Renames the first option (a change the customer sees) and marks the job ready again, through the API. */
async function changeOption(page: Page, jobId: string, name: string): Promise<void> {
  const headers = await api(page);
  const desk = (await (await page.request.get(`/api/jobs/${jobId}/desk`)).json()) as {
    options: { id: string; version: number; name: string; design: unknown }[];
  };
  const first = desk.options[0];
  if (!first) throw new Error('the ready job has no option');
  const saved = await page.request.patch(`/api/jobs/${jobId}/options/${first.id}`, {
    headers: { ...headers, 'If-Match': `"${first.version}"` },
    data: { name, design: first.design },
  });
  expect(saved.status(), await saved.text()).toBe(200);
  const ready = await page.request.post(`/api/jobs/${jobId}/ready`, { headers, data: {} });
  expect(ready.status(), await ready.text()).toBe(200);
}

const issueButton = (page: Page) => page.getByRole('button', { name: /^Issue version \d+$/ });

/** Issues the next version from the screen and waits for its PDF preview; returns its number. */
async function issueAndWaitForPdf(page: Page): Promise<number> {
  const label = (await issueButton(page).textContent()) ?? '';
  const n = Number(/(\d+)$/.exec(label)?.[1]);
  await issueButton(page).click();
  await page.getByText(`Version ${n} issued.`).waitFor();
  const pdf = page.getByRole('region', { name: `PDF of version ${n}` });
  // The queue makes it in the background; the screen polls until the preview is there.
  await pdf.getByTitle(`Proposal version ${n}, PDF preview`).waitFor({ timeout: 60_000 });
  await pdf.getByRole('link', { name: 'Download the PDF' }).waitFor();
  return n;
}

describe('the office’s proposal screen', () => {
  it('issues from the desk’s ready job, shows the PDF, issues again after a change and reads what changed (1440 and 375 px)', async () => {
    if (!estimator) throw new Error('no Quillbrook estimator');
    const { context, page } = await e.newPage(DESKTOP);
    await signIn(page, estimator.email, estimator.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    const jobId = await readyJob(page);

    await page.goto(`/jobs/${jobId}/desk`);
    const ready = page.getByRole('region', { name: 'Ready to propose' });
    await ready.getByRole('link', { name: /^(Go to the proposal|The proposal)$/ }).click();
    await page.waitForURL(`**/jobs/${jobId}/proposal`);
    await page.getByRole('heading', { level: 1, name: /^Proposal — / }).waitFor();
    expect(await axeViolations(page)).toEqual([]);

    const first = await issueAndWaitForPdf(page);
    const versions = page.getByRole('region', { name: 'Versions' });
    await versions.getByRole('button', { name: new RegExp(`^Version ${first}\\s*Current`) }).waitFor();
    await page.screenshot({ path: `${SHOTS}/proposal-office-issued-1440.png`, fullPage: true });
    expect(await axeViolations(page)).toEqual([]);

    const renamed = `Essential ${first + 1}`;
    await changeOption(page, jobId, renamed);
    await page.reload();
    const second = await issueAndWaitForPdf(page);
    expect(second).toBe(first + 1);
    await versions.getByRole('button', { name: new RegExp(`^Version ${first}\\s*Superseded`) }).waitFor();

    // What changed: the newest pair by default; the renamed option is said once.
    const changed = page.getByRole('region', { name: 'What changed' });
    await changed.getByLabel('From').selectOption(String(first));
    await changed.getByLabel('To').selectOption(String(second));
    await changed.getByText(new RegExp(`name “.+” → “${renamed}”`)).waitFor();
    // The trail in order: the last issuing events are this journey's.
    const trail = page.getByRole('list', { name: 'Audit trail' });
    const titles = await trail.locator('li > span:first-child').allTextContents();
    const tail = titles.filter((t) => !t.startsWith('PDF of')).slice(-3);
    expect(tail).toEqual([
      `Version ${first} issued`,
      `Version ${first} superseded by version ${second}`,
      `Version ${second} issued`,
    ]);
    await page.screenshot({ path: `${SHOTS}/proposal-office-changed-1440.png`, fullPage: true });
    expect(await axeViolations(page)).toEqual([]);

    // A phone: no sideways scroll; the PDF opens by its buttons (no frame on a phone).
    await page.setViewportSize(PHONE);
    const widths = await page.evaluate(() => ({
      page: document.documentElement.scrollWidth,
      viewport: document.documentElement.clientWidth,
    }));
    expect(widths.page).toBeLessThanOrEqual(widths.viewport);
    await page
      .getByRole('region', { name: `PDF of version ${second}` })
      .getByRole('link', { name: 'Download the PDF' })
      .waitFor();
    // On a phone the shown version's PDF comes before sending it and the audit trail is last.
    const top = async (name: string) =>
      (await page.getByRole('heading', { level: 2, name, exact: true }).boundingBox())?.y ?? Number.NaN;
    const order = [
      await top('Versions'),
      await top(`PDF of version ${second}`),
      await top('Send to the customer'),
      await top('What changed'),
      await top('What happened, in order'),
    ];
    expect(order).toEqual([...order].sort((x, y) => x - y));
    await page.screenshot({ path: `${SHOTS}/proposal-office-375.png`, fullPage: true });
    expect(await axeViolations(page)).toEqual([]);
    await context.close();
  });
});
