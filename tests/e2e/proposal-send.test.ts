import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PROPOSAL_LINK_OPEN_PATH } from '@contract';
import type { StoredMail } from '../../server/src/fakes/smtp-fake';
import { checkedPages, expectNoSeriousViolations } from './axe';
import { api } from './proposal-helpers';
import { account, expectFitsWidth, jobWithRooms } from './desk-helpers';
import { DESKTOP, PHONE, SHOTS, signIn, startE2E, type E2E } from './harness';

/**
 * Issue 14, sending: the estimator sends a proposal version; the customer opens the e-mailed link on a phone
 * (375 px), lands on the clean page with the token gone, reads the proposal, chooses an option; the same page
 * at 1440 px shows the options side by side; a withdrawn link shows the "no longer works" page.
 */
let e: E2E;
beforeAll(async () => {
  e = await startE2E();
});
afterAll(async () => e?.close());

async function mailFor(to: string): Promise<StoredMail> {
  for (let i = 0; i < 300; i += 1) {
    const found = e.smtp.messages.filter((m) => m.to.includes(to)).at(-1);
    if (found) return found;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error(`no mail to ${to}`);
}

/** A demo job with two priced options, marked ready and issued as a version (the desk's own journeys cover that UI). */
async function issuedJob(page: Page): Promise<string> {
  const jobId = await jobWithRooms(page);
  const rooms = (await api(page, 'get', `/api/jobs/${jobId}/rooms`)).rooms as { id: string }[];
  const first = rooms[0]?.id ?? '';
  const pair = (name: string, k: number, lengthFt: number) => ({
    name,
    design: {
      zones: [{ key: 'z1', name: 'Main room', roomIds: [first], indoorUnitKey: `TSL-S${k}H-W` }],
      systems: [
        {
          key: 's1',
          name: 'Main system',
          outdoorUnitKey: `TSL-S${k}H-O`,
          circuits: [{ zoneKey: 'z1', lengthFt }],
          electrical: { circuitLengthFt: 40 },
        },
      ],
    },
  });
  await api(page, 'post', `/api/jobs/${jobId}/options`, pair('Essential', 12, 25));
  await api(page, 'post', `/api/jobs/${jobId}/options`, pair('Comfort plus', 18, 30));
  await api(page, 'post', `/api/jobs/${jobId}/ready`, {
    sizingOverride: { reason: 'The family wants the main room on its own system for now.' },
  });
  await api(page, 'post', `/api/jobs/${jobId}/proposal/versions`);
  return jobId;
}

describe('a proposal sent to the customer', () => {
  it('is read and chosen on a phone through the e-mailed link; the token never stays in the address bar', async () => {
    const office = await e.newPage(DESKTOP);
    const estimator = account('estimator');
    await signIn(office.page, estimator.email, estimator.password);
    await office.page.getByTestId('user-name').first().waitFor();
    const jobId = await issuedJob(office.page);

    // The estimator sends it from the proposal screen's "Send to the customer" panel.
    const to = `homeowner-${Date.now()}@example.com`;
    await office.page.goto(`/jobs/${jobId}/proposal`);
    const form = office.page.getByRole('form', { name: 'Send the proposal' });
    await form.getByLabel('Customer’s e-mail').fill(to);
    await form.getByRole('button', { name: /^Send version \d+$/ }).click();
    await office.page.getByText(`On its way to ${to}.`).waitFor();
    const mail = await mailFor(to);
    // The panel reads the real mail state: "Sent" once the mail server has taken it.
    await office.page.getByRole('list', { name: 'Links sent' }).getByText('Sent', { exact: true }).first().waitFor();
    await office.page.screenshot({ path: `${SHOTS}/proposal-send-panel-1440.png`, fullPage: true });
    await expectNoSeriousViolations(office.page);
    const link = new RegExp(`https?://\\S+${PROPOSAL_LINK_OPEN_PATH}\\?t=[A-Za-z0-9_-]{43}`).exec(mail.text)?.[0];
    if (!link) throw new Error(`no proposal link in: ${mail.text}`);
    const path = new URL(link).pathname + new URL(link).search;

    // The customer's phone: the link lands on /p/<id>, with the token gone from the address and history.
    const phone = await e.newPage(PHONE);
    const arrived = await phone.page.goto(path);
    await phone.page.getByRole('heading', { name: /^Your proposal,/ }).waitFor();
    const landed = new URL(phone.page.url());
    expect(landed.pathname).toMatch(/^\/p\/[0-9a-f-]{36}$/);
    expect(landed.search).toBe('');
    // One 303 from the link to the clean page, which was asked for without a Referer.
    const request = arrived?.request();
    expect(request?.redirectedFrom()?.url()).toBe(`${e.url}${path}`);
    expect(await request?.headerValue('referer')).toBeNull();
    await phone.page.getByRole('heading', { name: 'Your 2 options' }).waitFor();
    await phone.page.getByText('an estimate', { exact: false }).first().waitFor();
    await expectFitsWidth(phone.page);
    await phone.page.screenshot({ path: `${SHOTS}/customer-proposal-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);

    // Choose the second option; the page says what comes next and the choice can still change.
    await phone.page.getByRole('button', { name: 'Choose Comfort plus' }).click();
    await phone.page.getByRole('heading', { name: /^You chose Comfort plus/ }).waitFor();
    await phone.page.getByText('✓ Your choice').waitFor();
    await phone.page.getByRole('button', { name: 'Choose Essential instead' }).waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/customer-proposal-chosen-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    const proposalId = landed.pathname.split('/')[2] ?? '';

    // The office sees the trail in order: sent, opened, viewed, option chosen.
    const trail = (await api(office.page, 'get', `/api/jobs/${jobId}/proposal`)).proposal as {
      events: { kind: string; data: Record<string, unknown> }[];
    };
    const kinds = trail.events.map((x) => x.kind).filter((k) => !k.startsWith('pdf-'));
    expect(kinds.slice(-4)).toEqual(['sent', 'opened', 'viewed', 'option-chosen']);
    expect(trail.events.at(-1)?.data.position).toBe(2);

    // The same link on a wide screen: the options side by side.
    const desk = await e.newPage(DESKTOP);
    await desk.page.goto(path);
    await desk.page.getByRole('heading', { name: 'Your 2 options' }).waitFor();
    const boxes = await desk.page
      .locator('article')
      .evaluateAll((els) => els.map((el) => el.getBoundingClientRect().top));
    expect(boxes).toHaveLength(2);
    expect(Math.abs((boxes[0] ?? 0) - (boxes[1] ?? 1))).toBeLessThan(2);
    await desk.page.screenshot({ path: `${SHOTS}/customer-proposal-1440.png`, fullPage: true });
    await expectNoSeriousViolations(desk.page);

    // Withdrawn by the office: the open page's next read, and the link itself, say it no longer works.
    const links = (await api(office.page, 'get', `/api/jobs/${jobId}/proposal/links`)).links as { id: string }[];
    await api(office.page, 'post', `/api/jobs/${jobId}/proposal/links/${links[0]?.id ?? ''}/revoke`);
    await phone.page.reload();
    await phone.page.getByRole('heading', { name: 'This link no longer works' }).waitFor();
    await phone.page.getByText('has withdrawn this link').waitFor();
    await phone.page.screenshot({ path: `${SHOTS}/customer-link-ended-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    const fresh = await e.newPage(PHONE);
    await fresh.page.goto(path);
    await fresh.page.getByRole('heading', { name: 'This link no longer works' }).waitFor();
    await fresh.page.screenshot({ path: `${SHOTS}/customer-link-ended-server-375.png`, fullPage: true });
    await expectNoSeriousViolations(fresh.page);

    for (const p of ['/p/:id', '/jobs/:id/proposal']) expect([...checkedPages], p).toContain(p);
    expect(proposalId).toMatch(/^[0-9a-f-]{36}$/);
    for (const c of [office, phone, desk, fresh]) await c.context.close();
  });
});
