import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PROPOSAL_LINK_OPEN_PATH } from '@contract';
import { DEMO_PROPOSAL_STATES } from '../../fixtures/demo-proposal-states';
import { demoAccounts } from '../../fixtures/seed';
import { directoryOutbox } from '../../server/src/fakes/smtp-fake';
import { expectNoSeriousViolations } from './axe';
import { expectFitsWidth } from './desk-helpers';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

/**
 * The demo's proposals in every state as people see them (fixtures/demo-proposal-states.ts): the office's jobs
 * list with the statuses the proposals gave, the proposal screen of the signed job (who signed, the sealed copy),
 * and the customer's page opened on a phone from the link in the demo's own e-mail (scripts/test.ts keeps the
 * seed's e-mails in DEMO_OUTBOX_DIR, as `npm start` keeps them in .data/outbox for /dev/outbox).
 */
let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

const estimatorOf = (company: string) => {
  const a = demoAccounts.find((x) => x.role === 'estimator' && x.company === company);
  if (!a) throw new Error(`no demo estimator of ${company}`);
  return a;
};
const spec = (state: string) => {
  const s = DEMO_PROPOSAL_STATES.find((x) => x.state === state);
  if (!s) throw new Error(`no demo ${state} proposal`);
  return s;
};

describe('the demo proposals in a browser', () => {
  it('the jobs list shows each state at 1440 px; the signed job’s proposal screen says who signed and offers the sealed copy', async () => {
    const signed = spec('signed');
    const acct = estimatorOf(signed.company);
    const { page } = await e.newPage(DESKTOP);
    await signIn(page, acct.email, acct.password);
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.goto('/jobs');
    // The sales history (reports) fills the list too: each demo proposal's job is found with the list's search.
    for (const s of DEMO_PROPOSAL_STATES.filter((x) => x.company === signed.company)) {
      await page.getByLabel('Search jobs').fill(s.customer.name);
      await page.getByText(s.customer.name).filter({ visible: true }).first().waitFor();
    }
    await page.getByLabel('Search jobs').fill('');
    await page.screenshot({ path: `${SHOTS}/demo-jobs-larkspur-1440.png`, fullPage: true });
    await expectNoSeriousViolations(page);

    const jobs = (await (await page.request.get('/api/jobs?pageSize=100')).json()) as {
      items: { id: string; customer: { name: string } }[];
    };
    const job = jobs.items.find((j) => j.customer.name === signed.customer.name);
    if (!job) throw new Error('the signed demo job is not listed');
    await page.goto(`/jobs/${job.id}/proposal`);
    const panel = page.getByRole('region', { name: 'Signed' });
    await panel.waitFor();
    await page.getByText(signed.customer.name).filter({ visible: true }).first().waitFor();
    expect(await page.getByRole('button', { name: /^Issue version/ }).count()).toBe(0);
    await page.screenshot({ path: `${SHOTS}/demo-proposal-signed-1440.png`, fullPage: true });
    await expectNoSeriousViolations(page);

    const other = estimatorOf(spec('sent').company);
    const q = await e.newPage(DESKTOP);
    await signIn(q.page, other.email, other.password);
    await q.page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await q.page.goto('/jobs');
    for (const s of DEMO_PROPOSAL_STATES.filter((x) => x.company === other.company)) {
      await q.page.getByLabel('Search jobs').fill(s.customer.name);
      await q.page.getByText(s.customer.name).filter({ visible: true }).first().waitFor();
    }
    await q.page.getByLabel('Search jobs').fill('');
    await q.page.screenshot({ path: `${SHOTS}/demo-jobs-quillbrook-1440.png`, fullPage: true });
  });

  it('the sent proposal’s e-mailed link opens the customer’s page on a phone (375 px)', async () => {
    const sent = spec('sent');
    const dir = process.env.DEMO_OUTBOX_DIR;
    if (!dir) throw new Error('DEMO_OUTBOX_DIR is not set: run with `npm test`');
    const mail = (await directoryOutbox(dir).list()).find((m) => m.to.includes(sent.customer.email));
    const link = new RegExp(`https?://\\S+${PROPOSAL_LINK_OPEN_PATH}\\?t=[A-Za-z0-9_-]{43}`).exec(
      mail?.text ?? '',
    )?.[0];
    if (!link) throw new Error(`no demo proposal link to ${sent.customer.email}`);
    const { page } = await e.newPage(PHONE);
    await page.goto(new URL(link).pathname + new URL(link).search);
    await page.getByRole('heading', { name: /^Your proposal,/ }).waitFor();
    expect(new URL(page.url()).pathname).toMatch(/^\/p\/[0-9a-f-]{36}$/);
    await page.getByRole('heading', { name: 'Your 2 options' }).waitFor();
    await expectFitsWidth(page);
    await page.screenshot({ path: `${SHOTS}/demo-customer-sent-375.png`, fullPage: true });
    await expectNoSeriousViolations(page);
  });
});
