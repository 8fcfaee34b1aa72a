import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatMoney } from '@calc';
import type { AfterSigningRecord } from '@contract';
import { checkedPages, expectNoSeriousViolations } from './axe';
import { api, customerOnPhone, until } from './proposal-helpers';
import { expectFitsWidth } from './desk-helpers';
import { PHONE, SHOTS, startE2E, type E2E } from './harness';

/**
 * Issue 14, after the signature, at 375 px: the customer pays the deposit through the local payments fake
 * (a declined test card first, then one that pays; "Deposit paid" only once the server has the webhook),
 * and, coming back the next day, cancels within the three business days and sees the refund arrive.
 * Sending, choosing and signing have their own journeys; here the signing goes through its API from the
 * customer's own browser session.
 */
let e: E2E;

/** Consent and a typed signature through the signing API, in the customer's session (its PDF must be ready first). */
async function signAsCustomer(phone: Page, proposalId: string) {
  type Signing = {
    version: { number: number; pdfReady: boolean };
    consent: { sha256: string };
    statement: { sha256: string } | null;
    option: { position: number } | null;
    signerDefaults: { name: string; email: string };
  };
  const state = await until('the proposal PDF', async () => {
    const s = (await api(phone, 'get', `/api/proposals/${proposalId}/signing`)) as unknown as Signing;
    return s.version.pdfReady && s.statement ? s : undefined;
  });
  await api(phone, 'post', `/api/proposals/${proposalId}/consent`, {
    versionNumber: state.version.number,
    disclosureSha256: state.consent.sha256,
  });
  await api(phone, 'post', `/api/proposals/${proposalId}/signature`, {
    method: 'typed',
    versionNumber: state.version.number,
    optionPosition: state.option?.position ?? 1,
    statementSha256: state.statement?.sha256 ?? '',
    signerName: state.signerDefaults.name,
    signerEmail: state.signerDefaults.email,
    typedName: state.signerDefaults.name,
  });
}

const afterSigning = async (page: Page, proposalId: string) =>
  (await api(page, 'get', `/api/proposals/${proposalId}/after-signing`)) as unknown as AfterSigningRecord;

describe('after the signature, on the phone', () => {
  beforeAll(async () => {
    e = await startE2E();
  });
  afterAll(async () => e?.close());

  it('pays the deposit through the payment service (a declined card first), then cancels the next visit and sees the refund', async () => {
    const { office, phone, jobId, path } = await customerOnPhone(e);
    const proposalId = new URL(phone.page.url()).pathname.split('/')[2] ?? '';
    await phone.page.getByRole('button', { name: 'Choose Quiet comfort' }).click();
    await phone.page.getByRole('heading', { name: /^You chose Quiet comfort/ }).waitFor();
    await signAsCustomer(phone.page, proposalId);
    const due = (await afterSigning(phone.page, proposalId)).deposit.amountCents;
    expect(due).toBeGreaterThan(0);
    const amount = formatMoney(due);

    // The deposit step, after a reload (as the customer comes back to the page once signed).
    await phone.page.reload();
    const pay = phone.page.getByRole('button', { name: `Pay ${amount}` });
    await pay.waitFor();
    await phone.page.getByRole('heading', { name: `Pay the deposit of ${amount}` }).waitFor();
    await phone.page.getByText('Test mode — no real money moves').waitFor();
    await pay.scrollIntoViewIfNeeded();
    await expectFitsWidth(phone.page);
    await phone.page.screenshot({ path: `${SHOTS}/customer-deposit-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);

    // A declined test card: said plainly, nothing paid, and the step stays to try again.
    await phone.page.getByRole('radio', { name: /Test card that is declined/ }).check();
    await pay.click();
    await phone.page.getByText('The payment did not go through').waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/customer-deposit-declined-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    expect((await afterSigning(phone.page, proposalId)).deposit.state).not.toBe('succeeded');

    // The card that pays: "Deposit paid" once the server has the service's webhook.
    await phone.page.getByRole('radio', { name: /Test card that pays/ }).check();
    await pay.click();
    await phone.page.getByRole('heading', { name: 'Deposit paid' }).waitFor();
    expect((await afterSigning(phone.page, proposalId)).deposit.state).toBe('succeeded');
    const intents = [...e.payments.intents.values()].filter((i) => i.metadata.proposalId === proposalId);
    expect(intents.map((i) => [i.status, i.amount])).toEqual([['succeeded', due]]);
    await phone.page
      .getByText(/You may cancel this agreement, without any penalty or obligation, until midnight/)
      .waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/customer-deposit-paid-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    await phone.context.close();

    // The next visit, on the same link's session in a new tab: cancel within the window.
    const again = await e.newPage(PHONE);
    await again.page.goto(path);
    const cancelButton = again.page.getByRole('button', { name: 'Cancel this agreement' });
    await cancelButton.waitFor();
    await cancelButton.click();
    await again.page.getByText('Cancel the agreement you signed?').waitFor();
    await again.page.getByLabel('Why are you cancelling? (optional)').fill('We found the money is needed elsewhere.');
    await again.page.screenshot({ path: `${SHOTS}/customer-cancel-confirm-375.png`, fullPage: true });
    await expectNoSeriousViolations(again.page);
    await again.page.getByRole('button', { name: 'Yes, cancel the agreement' }).click();
    await again.page
      .getByRole('heading', { name: `Cancelled — your deposit of ${amount} has been refunded` })
      .waitFor();
    await expectFitsWidth(again.page);
    await again.page.screenshot({ path: `${SHOTS}/customer-cancelled-refunded-375.png`, fullPage: true });
    await expectNoSeriousViolations(again.page);
    const refunds = [...e.payments.refunds.values()].filter((r) => r.payment_intent === intents[0]?.id);
    expect(refunds.map((r) => r.amount)).toEqual([due]);

    // The office: the job lost "Cancelled by buyer"; the trail in order.
    const job = (await api(office.page, 'get', `/api/jobs/${jobId}`)).job as {
      status: string;
      lostReason: string | null;
    };
    expect([job.status, job.lostReason]).toEqual(['lost', 'Cancelled by buyer']);
    const trail = (await api(office.page, 'get', `/api/jobs/${jobId}/proposal`)).proposal as {
      events: { kind: string }[];
    };
    const money = ['consented', 'signed', 'paid', 'cancelled', 'refunded'];
    expect(trail.events.map((x) => x.kind).filter((k) => money.includes(k))).toEqual(money);
    for (const p of ['/p/:id']) expect([...checkedPages], p).toContain(p);
    await again.context.close();
    await office.context.close();
  });
});
