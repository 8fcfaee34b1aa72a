import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectNoSeriousViolations } from './axe';
import { customerOnPhone } from './proposal-helpers';
import { expectFitsWidth } from './desk-helpers';
import { SHOTS, startE2E, type E2E } from './harness';

/**
 * Issue 14, signing at 375 px through the customer's page: the consent notice and its tick box, a signature
 * drawn with the pointer in a box at least 190 px high, "Sign and accept the proposal", then the sealed copy
 * to download once the queue has made it (served as a PDF). Screenshots customer-sign-*-375.png.
 */
let e: E2E;

describe('signing on the phone', () => {
  beforeAll(async () => {
    e = await startE2E();
  });
  afterAll(async () => e?.close());

  it('consents, draws a signature with a finger-sized box, signs and downloads the sealed copy', async () => {
    const { office, phone, jobId } = await customerOnPhone(e);
    await phone.page.getByRole('button', { name: 'Choose Quiet comfort' }).click();
    await phone.page.getByRole('heading', { name: /^You chose Quiet comfort/ }).waitFor();
    const box = phone.page.getByRole('checkbox', { name: /I agree to sign electronically/ });
    await box.waitFor();
    await box.scrollIntoViewIfNeeded();
    await phone.page.screenshot({ path: `${SHOTS}/customer-sign-consent-375.png`, fullPage: true });
    await expectFitsWidth(phone.page);
    await box.check();
    await phone.page.getByRole('button', { name: /I agree — continue to sign/ }).click();
    const canvas = phone.page.getByRole('img', { name: /Signature box/ });
    await canvas.waitFor();
    await canvas.scrollIntoViewIfNeeded();
    const b = (await canvas.boundingBox())!;
    expect(b.height).toBeGreaterThanOrEqual(190);
    expect(b.width).toBeGreaterThan(260);
    await phone.page.mouse.move(b.x + 20, b.y + 140);
    await phone.page.mouse.down();
    for (let i = 1; i <= 20; i++) await phone.page.mouse.move(b.x + 20 + i * 13, b.y + 140 - Math.sin(i / 3) * 60);
    await phone.page.mouse.up();
    await phone.page.screenshot({ path: `${SHOTS}/customer-sign-draw-375.png`, fullPage: true });
    await expectNoSeriousViolations(phone.page);
    await phone.page.getByRole('button', { name: 'Sign and accept the proposal' }).click();
    const download = phone.page.getByRole('link', { name: 'Download your signed copy (PDF)' });
    await download.waitFor({ timeout: 60_000 });
    await download.scrollIntoViewIfNeeded();
    // Signed, the choice is settled (the server refuses another): no card offers a different option and the
    // page no longer says the choice can change.
    await phone.page.getByRole('heading', { name: /^You signed for Quiet comfort/ }).waitFor();
    await phone.page.getByText('✓ Signed').waitFor();
    expect(await phone.page.getByRole('button', { name: /^Choose / }).count()).toBe(0);
    expect(await phone.page.getByText(/change your mind/).count()).toBe(0);
    await phone.page.screenshot({ path: `${SHOTS}/customer-sign-signed-375.png`, fullPage: true });
    const href = await download.getAttribute('href');
    const res = await phone.page.request.get(href ?? '');
    expect(res.status()).toBe(200);
    expect(res.headers()['content-type']).toBe('application/pdf');

    // The office's proposal screen: who signed and when, and the same sealed copy to download.
    await office.page.goto(`/jobs/${jobId}/proposal`);
    await office.page
      .getByText(/^Signed by /)
      .first()
      .waitFor();
    const officeCopy = office.page.getByRole('link', { name: 'Download the signed copy' });
    await officeCopy.waitFor({ timeout: 60_000 });
    const theirs = await office.page.request.get((await officeCopy.getAttribute('href')) ?? '');
    expect(theirs.status()).toBe(200);
    expect(theirs.headers()['content-type']).toBe('application/pdf');
    expect(Buffer.compare(await theirs.body(), await res.body())).toBe(0);
    await office.page.screenshot({ path: `${SHOTS}/proposal-office-signed-1440.png`, fullPage: true });
    await expectNoSeriousViolations(office.page);
  });
});
